/** Native: nothing is drawn before the app runs. */
export function markAppStarted(): void {}
