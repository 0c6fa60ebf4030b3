/// <reference types="vite/client" />

/** package.json version, plus "+tag" for a tagged build variant. */
declare const __APP_VERSION__: string;
/** The other origin the CSP lets plant sync reach (TANKSIDE_SYNC_ORIGIN at build time); '' for none. */
declare const __SYNC_ORIGIN__: string;
