import { createAuthClient } from 'better-auth/react';

/** better-auth's browser client; the API is same-origin, so the page's origin is the base URL. */
export const authClient = createAuthClient({ baseURL: window.location.origin });
