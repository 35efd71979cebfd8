import { useState } from 'react';

/**
 * The same object for as long as its content stays the same (compared as JSON), so that an
 * effect can depend on a value that is rebuilt on every render — a placement, a size, a look —
 * and run only when what it holds changes. Plain data only.
 */
export function useSteadyValue<T>(value: T): T {
  const [steady, setSteady] = useState(value);
  // Setting state while rendering is React's documented way to follow a changed input; React
  // renders again at once without committing the stale value.
  if (JSON.stringify(steady) !== JSON.stringify(value)) {
    setSteady(value);
    return value;
  }
  return steady;
}
