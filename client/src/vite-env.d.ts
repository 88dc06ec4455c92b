/// <reference types="vite/client" />

// Declaration merging with Vite's own ImportMetaEnv needs `interface` here.
// eslint-disable-next-line @typescript-eslint/consistent-type-definitions
interface ImportMetaEnv {
  readonly VITE_API_URL?: string;
  readonly VITE_API_DOCS_URL?: string;
}
