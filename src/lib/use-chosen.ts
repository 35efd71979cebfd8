import { useState } from 'react';

/** A set of chosen ids (checkbox lists), starting from `initial`, with a toggle. */
export function useChosen(initial: Iterable<string>) {
  const [chosen, setChosen] = useState<ReadonlySet<string>>(() => new Set(initial));
  const toggle = (id: string) =>
    setChosen((now) => {
      const next = new Set(now);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  return { chosen, toggle };
}
