import { LASER_CAUTIONS } from '#shared/safety.ts';
import { Notice } from '#src/components/ui/notice.tsx';

/** The cautions shown wherever recipes are set or run (the job sheet prints the same words). */
export function LaserCautions() {
  return (
    <Notice tone="caution" title="Before you burn">
      <ul className="list-disc space-y-0.5 pl-5">
        {LASER_CAUTIONS.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ul>
    </Notice>
  );
}
