/** Where a lapsed session goes: Sign in, then back to the screen it was on (the Inbox, the first screen, goes without saying). */
export function signInPathFor(pathname: string, search: string): string {
  return pathname === '/' || pathname === '/inbox'
    ? '/sign-in'
    : `/sign-in?next=${encodeURIComponent(pathname + search)}`;
}
