/**
 * The optional chime for a new alert. Off unless the user turns it on (a console at a quiet gate must not beep by
 * surprise); the choice is kept per browser.
 */
const KEY = 'bumpboard.alertSound';

export function alertSoundOn(): boolean {
  try {
    return localStorage.getItem(KEY) === 'on';
  } catch {
    return false;
  }
}

export function setAlertSound(on: boolean) {
  try {
    localStorage.setItem(KEY, on ? 'on' : 'off');
  } catch {
    // Storage refused (private mode): the setting lasts for this page only, which is still safe (off by default).
  }
}

/** Two short tones; a browser that has not been interacted with yet may refuse, which is fine for an extra cue. */
export function playChime() {
  const Ctx = (globalThis as { AudioContext?: typeof AudioContext }).AudioContext;
  if (!Ctx) return;
  try {
    const ctx = new Ctx();
    [660, 880].forEach((hz, i) => {
      const osc = ctx.createOscillator();
      const gain = ctx.createGain();
      osc.frequency.value = hz;
      gain.gain.value = 0.15;
      osc.connect(gain).connect(ctx.destination);
      osc.start(ctx.currentTime + i * 0.2);
      osc.stop(ctx.currentTime + i * 0.2 + 0.15);
    });
    setTimeout(() => void ctx.close(), 800);
  } catch {
    // No audio device: the visible notice and the tab title still carry the alert.
  }
}
