/**
 * A duration for people: `850 ms`, `42.3 s`, `12 min 05 s`, `3 h 07 min`.
 *
 * @param seconds elapsed time (s, >= 0)
 * @returns the text; `unknown` for a negative or non-finite value
 * @example formatWallTime(725) // '12 min 05 s'
 */
export function formatWallTime(seconds: number): string {
  if (!(seconds >= 0) || !Number.isFinite(seconds)) return 'unknown';
  if (seconds < 1) return `${Math.round(seconds * 1000)} ms`;
  if (seconds < 60) return `${seconds.toFixed(1)} s`;
  const total = Math.round(seconds);
  const hours = Math.floor(total / 3600);
  const minutes = Math.floor((total % 3600) / 60);
  const rest = total % 60;
  if (hours === 0) return `${minutes} min ${String(rest).padStart(2, '0')} s`;
  return `${hours} h ${String(minutes).padStart(2, '0')} min`;
}
