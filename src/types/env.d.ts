/// <reference types="vite-plugin-pwa/client" />

/** package.json's version, set at build time; it also invalidates the cache kept on the device. */
declare const __APP_VERSION__: string;
