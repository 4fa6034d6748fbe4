// Apart from the hook (kept-form.ts), so that sign-out, in every page's code, carries only this.

/** Where a half-written care form is kept: `care.kept.<form>` in this tab's session storage. */
export const KEPT_FORM_PREFIX = 'care.kept.';

export const keptFormStore = (): Storage | undefined => (typeof globalThis.sessionStorage === 'undefined' ? undefined : globalThis.sessionStorage);

/** At sign-out: nobody else on this phone reads what the last person was writing. */
export function forgetKeptForms() {
  const s = keptFormStore();
  if (!s) return;
  for (const k of Object.keys(s)) if (k.startsWith(KEPT_FORM_PREFIX)) s.removeItem(k);
}
