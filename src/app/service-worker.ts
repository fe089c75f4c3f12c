import { registerSW } from 'virtual:pwa-register';

/** The service worker keeps the app shell on the device, so the app opens with no signal. */
export function registerServiceWorker() {
  if (import.meta.env.DEV || !('serviceWorker' in navigator)) return;
  registerSW({ immediate: true });
}
