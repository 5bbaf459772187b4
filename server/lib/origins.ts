/**
 * The app's own origin(s). With APP_URL set, that one; otherwise both http://localhost:PORT and
 * http://127.0.0.1:PORT, so sign-in works from either, plus any extra development origins (the Vite dev server).
 */
export function appOrigins(port: number, appUrl: string | undefined, extra: string[] = []) {
  const baseURL = appUrl ? new URL(appUrl).origin : `http://localhost:${port}`;
  const trusted = appUrl ? [baseURL] : [`http://localhost:${port}`, `http://127.0.0.1:${port}`];
  return { baseURL, trustedOrigins: [...new Set([...trusted, ...extra])] };
}
