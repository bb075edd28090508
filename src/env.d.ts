/// <reference types="vite/client" />
/// <reference types="vite-plugin-pwa/client" />

interface ImportMetaEnv {
  /** API origin when it differs from the app's (default: same origin). */
  readonly VITE_API_BASE_URL?: string
}
