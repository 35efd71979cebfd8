import { INSCRIPTION_FONTS, type Inscription } from '#shared/schemas/checkout.ts';

export type InscriptionDraft = Inscription & { on: boolean };

/** Step 4 (optional): one or two lines of lettering under the photo, their face and size. */
export function WordsStep({ inscription, onChange }: { inscription: InscriptionDraft; onChange(next: InscriptionDraft): void }) {
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">4. Words (optional)</legend>
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={inscription.on}
          onChange={(e) => onChange({ ...inscription, on: e.target.checked })}
          className="size-6 shrink-0 accent-[var(--color-accent)]"
        />
        Add a line of text under the photo
      </label>
      {inscription.on && (
        <div className="flex flex-col gap-2">
          {[0, 1].map((i) => (
            <label key={i} className="flex flex-col gap-1 text-sm font-semibold">
              {i === 0 ? 'First line' : 'Second line (optional)'}
              <input
                value={inscription.lines[i] ?? ''}
                maxLength={40}
                onChange={(e) => {
                  const lines = [...inscription.lines];
                  lines[i] = e.target.value;
                  onChange({ ...inscription, lines });
                }}
                className="h-10 rounded-lg border border-graphite-200 px-3 font-normal"
              />
            </label>
          ))}
          <div className="flex flex-wrap gap-3">
            <label className="flex min-w-36 flex-1 flex-col gap-1 text-sm font-semibold">
              Lettering
              <select
                value={inscription.font}
                onChange={(e) => onChange({ ...inscription, font: e.target.value as Inscription['font'] })}
                className="h-10 rounded-lg border border-graphite-200 px-2 font-normal"
              >
                {Object.entries(INSCRIPTION_FONTS).map(([value, label]) => (
                  <option key={value} value={value}>
                    {label}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex min-w-36 flex-1 flex-col gap-1 text-sm font-semibold">
              Size
              <input
                type="range"
                min={0.04}
                max={0.2}
                step={0.005}
                value={inscription.size}
                onChange={(e) => onChange({ ...inscription, size: Number(e.target.value) })}
                className="h-10 accent-[var(--color-accent)]"
              />
            </label>
          </div>
        </div>
      )}
    </fieldset>
  );
}
