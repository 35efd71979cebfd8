/** A material's look in small: its surface with a stroke of the colour a burn leaves. */
export function Swatch({ surface, mark, size = 'size-7' }: { surface: string; mark: string; size?: string }) {
  return (
    <span
      aria-hidden
      className={`${size} inline-block shrink-0 overflow-hidden rounded-md ring-1 ring-graphite-200`}
      style={{ background: `linear-gradient(135deg, ${surface} 55%, ${mark} 55%)` }}
    />
  );
}
