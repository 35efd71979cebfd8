import { useEffect, useRef, useState, type PointerEvent as ReactPointerEvent } from 'react';
import type { Cutout, CutoutStroke } from '#shared/schemas/prep.ts';
import { Button } from '#src/components/ui/button.tsx';
import { cx } from '#src/lib/cx.ts';

export type Brush = { mode: CutoutStroke['mode']; size: number };

/**
 * Paints one stroke at a time over the preview. Points are kept in the engraving area's own
 * 0–1 coordinates, so a stroke means the same on screen and at the machine's resolution. The
 * stroke shows while it is drawn; once let go, it is handed over and the preview redraws with it.
 */
export function BrushOverlay({
  size,
  brush,
  onStroke,
  label,
}: {
  size: { width: number; height: number };
  brush: Brush;
  onStroke: (stroke: CutoutStroke) => void;
  label: string;
}) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const points = useRef<Array<[number, number]>>([]);
  const [drawing, setDrawing] = useState(false);

  const at = (event: ReactPointerEvent<HTMLCanvasElement>): [number, number] => {
    const box = event.currentTarget.getBoundingClientRect();
    return [(event.clientX - box.left) / box.width, (event.clientY - box.top) / box.height];
  };
  const paint = () => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx) return;
    ctx.clearRect(0, 0, size.width, size.height);
    const pts = points.current;
    if (!pts.length) return;
    const colour = brush.mode === 'keep' ? 'rgb(76 122 58 / 0.55)' : 'rgb(179 54 42 / 0.55)';
    const [x0, y0] = [pts[0]![0] * size.width, pts[0]![1] * size.height];
    if (pts.length === 1) {
      ctx.fillStyle = colour;
      ctx.beginPath();
      ctx.arc(x0, y0, (brush.size * size.width) / 2, 0, 2 * Math.PI);
      ctx.fill();
      return;
    }
    ctx.strokeStyle = colour;
    ctx.lineWidth = brush.size * size.width;
    ctx.lineCap = 'round';
    ctx.lineJoin = 'round';
    ctx.beginPath();
    ctx.moveTo(x0, y0);
    for (const [x, y] of pts.slice(1)) ctx.lineTo(x * size.width, y * size.height);
    ctx.stroke();
  };
  const finish = () => {
    if (!drawing) return;
    setDrawing(false);
    const stroke = { mode: brush.mode, size: brush.size, points: points.current };
    points.current = [];
    paint();
    if (stroke.points.length) onStroke(stroke);
  };

  return (
    <canvas
      ref={canvas}
      width={size.width}
      height={size.height}
      aria-label={label}
      className="absolute inset-0 h-full w-full touch-none"
      style={{ cursor: 'crosshair' }}
      onPointerDown={(event) => {
        event.currentTarget.setPointerCapture(event.pointerId);
        points.current = [at(event)];
        setDrawing(true);
        paint();
      }}
      onPointerMove={(event) => {
        if (!drawing) return;
        const [x, y] = at(event);
        const last = points.current.at(-1)!;
        // A point every few screen pixels is plenty; the server fills the line between them.
        if (Math.hypot(x - last[0], y - last[1]) * size.width < 2 || points.current.length >= 4000) return;
        points.current.push([x, y]);
        paint();
      }}
      onPointerUp={finish}
      onPointerCancel={finish}
    />
  );
}

/** The cut-out's controls: where it starts, the brush, and undo / redo over the strokes. */
export function CutoutControls({
  cutout,
  brush,
  redo,
  disabled,
  onChange,
  onBrush,
  onUndo,
  onRedo,
}: {
  cutout: Cutout;
  brush: Brush;
  redo: number;
  disabled: boolean;
  onChange: (cutout: Cutout) => void;
  onBrush: (brush: Brush) => void;
  onUndo: () => void;
  onRedo: () => void;
}) {
  // Undo and redo from the keyboard, as everywhere else.
  useEffect(() => {
    if (disabled) return;
    const onKey = (event: KeyboardEvent) => {
      if (!(event.ctrlKey || event.metaKey) || (event.target as HTMLElement).closest('input, textarea, select')) return;
      const key = event.key.toLowerCase();
      if (key === 'z' && !event.shiftKey) onUndo();
      else if ((key === 'z' && event.shiftKey) || key === 'y') onRedo();
      else return;
      event.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [disabled, onUndo, onRedo]);

  return (
    <div className="flex flex-col gap-4 text-sm">
      <fieldset className="flex flex-col gap-1" disabled={disabled}>
        <legend className="mb-1 font-semibold">Start from</legend>
        <label className="flex items-center gap-2">
          <input
            type="radio"
            name="cutout-start"
            checked={cutout.start === 'whole'}
            onChange={() => onChange({ ...cutout, start: 'whole' })}
          />{' '}
          The whole photo
        </label>
        <label className="flex items-center gap-2">
          <input
            type="radio"
            name="cutout-start"
            checked={cutout.start === 'plain-background'}
            onChange={() => onChange({ ...cutout, start: 'plain-background' })}
          />{' '}
          Without a plain background
        </label>
        {cutout.start === 'plain-background' && (
          <label className="mt-1 flex items-center gap-3">
            <span className="w-36">Background likeness</span>
            <input
              type="range"
              min={4}
              max={120}
              value={cutout.tolerance}
              onChange={(e) => onChange({ ...cutout, tolerance: Number(e.target.value) })}
              aria-label="Background likeness"
              className="flex-1"
            />
            <span className="w-8 text-right tabular-nums">{cutout.tolerance}</span>
          </label>
        )}
      </fieldset>
      <fieldset className="flex flex-col gap-2" disabled={disabled}>
        <legend className="mb-1 font-semibold">Brush</legend>
        <div className="flex gap-2" role="radiogroup" aria-label="Brush">
          {(['keep', 'remove'] as const).map((mode) => (
            <button
              key={mode}
              type="button"
              role="radio"
              aria-checked={brush.mode === mode}
              onClick={() => onBrush({ ...brush, mode })}
              className={cx(
                'rounded-lg px-3 py-1.5 font-semibold ring-1 ring-inset',
                brush.mode === mode
                  ? mode === 'keep'
                    ? 'bg-moss-100 text-moss-800 ring-moss-600'
                    : 'bg-rust-100 text-rust-800 ring-rust-600'
                  : 'bg-white ring-graphite-200',
              )}
            >
              {mode === 'keep' ? 'Keep' : 'Remove'}
            </button>
          ))}
        </div>
        <label className="flex items-center gap-3">
          <span className="w-36">Brush size</span>
          <input
            type="range"
            min={1}
            max={25}
            value={Math.round(brush.size * 100)}
            onChange={(e) => onBrush({ ...brush, size: Number(e.target.value) / 100 })}
            aria-label="Brush size"
            className="flex-1"
          />
          <span className="w-8 text-right tabular-nums">{Math.round(brush.size * 100)} %</span>
        </label>
      </fieldset>
      <div className="flex flex-wrap items-center gap-2">
        <Button size="sm" variant="secondary" disabled={disabled || !cutout.strokes.length} onClick={onUndo}>
          Undo
        </Button>
        <Button size="sm" variant="secondary" disabled={disabled || !redo} onClick={onRedo}>
          Redo
        </Button>
        <Button
          size="sm"
          variant="quiet"
          disabled={disabled || !cutout.strokes.length}
          onClick={() => onChange({ ...cutout, strokes: [] })}
        >
          Clear strokes
        </Button>
        <span className="text-graphite-600">{cutout.strokes.length === 1 ? '1 stroke' : `${cutout.strokes.length} strokes`}</span>
      </div>
    </div>
  );
}
