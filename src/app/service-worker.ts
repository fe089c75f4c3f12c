/** The service worker keeps the app shell on the device, so the app opens with no signal. */
export function registerServiceWorker() {
  if (import.meta.env.DEV || !('serviceWorker' in navigator)) return;
  // Its registration code is fetched after start-up rather than with the first page; if that
  // fails (no signal on a first visit), the next start tries again.
  void import('virtual:pwa-register').then(({ registerSW }) => registerSW({ immediate: true })).catch(() => undefined);
}
