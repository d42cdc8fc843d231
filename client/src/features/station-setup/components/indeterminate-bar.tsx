import { useEffect, useRef } from 'react';

/**
 * A bar for work of unknown length: a band that sweeps across while the request runs. No value is announced, which
 * is how assistive technology recognises an indeterminate progress bar (WAI-ARIA 1.2, progressbar role).
 */
export function IndeterminateBar({ label }: { label: string }) {
  const band = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = band.current;
    if (!el || typeof el.animate !== 'function') return;
    if (window.matchMedia?.('(prefers-reduced-motion: reduce)').matches) return;
    const sweep = el.animate([{ transform: 'translateX(-100%)' }, { transform: 'translateX(400%)' }], { duration: 1400, iterations: Infinity, easing: 'ease-in-out' });
    return () => sweep.cancel();
  }, []);
  return (
    <div role="progressbar" aria-label={label} aria-valuetext="In progress" className="h-3 w-full overflow-hidden rounded-full border border-harbour bg-harbour-soft">
      <div ref={band} className="h-full w-1/4 rounded-full bg-harbour" />
    </div>
  );
}
