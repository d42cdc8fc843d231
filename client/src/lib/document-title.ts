/**
 * The tab's title is the screen's own name plus, when something waits for the user, how many alerts: an agent with
 * the console in a background tab sees "(2) Flight desk ZZ 101 · Bumpboard" without switching to it.
 */
let pageTitle = '';
let alertCount = 0;

export function composeTitle(page: string, alerts: number): string {
  const base = page ? `${page} · Bumpboard` : 'Bumpboard';
  return alerts > 0 ? `(${alerts}) ${base}` : base;
}

function apply() {
  if (typeof document !== 'undefined') document.title = composeTitle(pageTitle, alertCount);
}

export function setPageTitle(title: string) {
  pageTitle = title;
  apply();
}

export function setAlertCount(n: number) {
  alertCount = Math.max(0, n);
  apply();
}
