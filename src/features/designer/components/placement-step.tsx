import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import {
  formatDegrees,
  leavesAreaEmpty,
  MAX_STRAIGHTEN,
  MAX_ZOOM,
  quarterTurnsOf,
  startFraming,
  straightening,
  turned,
} from '../placement.ts';
import type { FramingState } from '../use-framing.ts';

/** Step 3: zoom, fine straightening apart from quarter turns, mirror, fill or show it all; waits for a photo. */
export function PlacementStep({ framing: { photo, framing, frame, placement } }: { framing: FramingState }) {
  if (!photo || !framing)
    return (
      <fieldset disabled aria-describedby="placement-waits" className="flex flex-col gap-2 opacity-60">
        <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">3. Placement</legend>
        <p id="placement-waits" className="text-sm text-graphite-600">
          Choose a photo first; then move, zoom, turn and straighten it here.
        </p>
      </fieldset>
    );
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">3. Placement</legend>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        <span className="flex justify-between">
          <span>Zoom</span>
          <span className="font-normal text-graphite-600">{framing.zoom.toFixed(2)}×</span>
        </span>
        <input
          type="range"
          aria-label="Zoom"
          min={1}
          max={MAX_ZOOM}
          step={0.01}
          value={framing.zoom}
          onChange={(e) => frame((f) => ({ ...f, zoom: Number(e.target.value) }))}
          className="h-6 accent-[var(--color-accent)]"
        />
      </label>
      {/* Quarter turns and fine straightening are kept apart: the slider moves only the last ±15°. */}
      <label className="flex flex-col gap-1 text-sm font-semibold">
        <span className="flex justify-between">
          <span>Straighten</span>
          <span className="font-normal text-graphite-600">{formatDegrees(straightening(framing.rotation))}</span>
        </span>
        <input
          type="range"
          aria-label="Straighten"
          min={-MAX_STRAIGHTEN}
          max={MAX_STRAIGHTEN}
          step={0.5}
          value={straightening(framing.rotation)}
          onChange={(e) => frame((f) => ({ ...f, rotation: quarterTurnsOf(f.rotation) * 90 + Number(e.target.value) }))}
          className="h-6 accent-[var(--color-accent)]"
        />
      </label>
      <div className="flex flex-wrap gap-2">
        <Button size="sm" variant="secondary" onClick={() => frame((f) => ({ ...f, rotation: turned(f.rotation, -90) }))}>
          Turn left
        </Button>
        <Button size="sm" variant="secondary" onClick={() => frame((f) => ({ ...f, rotation: turned(f.rotation, 90) }))}>
          Turn right
        </Button>
        <Button size="sm" variant="secondary" aria-pressed={framing.flip} onClick={() => frame((f) => ({ ...f, flip: !f.flip }))}>
          Mirror
        </Button>
        <Button
          size="sm"
          variant="secondary"
          aria-pressed={framing.mode === 'fill'}
          onClick={() => frame((f) => ({ ...startFraming(photo, 'fill'), rotation: f.rotation, flip: f.flip }))}
        >
          Fill the area
        </Button>
        <Button
          size="sm"
          variant="secondary"
          aria-pressed={framing.mode === 'fit'}
          onClick={() => frame((f) => ({ ...startFraming(photo, 'fit'), rotation: f.rotation, flip: f.flip }))}
        >
          Show it all
        </Button>
      </div>
      {placement && leavesAreaEmpty(photo, placement) && (
        <Notice tone="caution">
          Part of the engraving area is left empty: nothing burns there. Choose “Fill the area” or zoom in for the photo to reach every
          edge.
        </Notice>
      )}
    </fieldset>
  );
}
