/** "5 hours 20 minutes", spelt out for a passenger rather than abbreviated. */
export function laterWords(minutes: number) {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  const part = (n: number, unit: string) => `${n} ${unit}${n === 1 ? '' : 's'}`;
  return [h > 0 ? part(h, 'hour') : '', m > 0 ? part(m, 'minute') : ''].filter(Boolean).join(' ');
}
