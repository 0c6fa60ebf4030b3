/// <reference types="vite/client" />

/** package.json version, plus "+tag" for a tagged build variant. */
declare const __APP_VERSION__: string;
