// Flags for Debian's Chromium wherever tests and benchmarks start it (root in a container: no sandbox;
// no GPU; no background traffic or updates to disturb a measurement). Headless mode is each caller's.
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
