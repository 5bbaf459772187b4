import '@tanstack/react-query';

/** Typed `meta` for queries and mutations (read by the global handlers in query-client.ts). */
declare module '@tanstack/react-query' {
  interface Register {
    queryMeta: { redirectOn401?: boolean };
    mutationMeta: { invalidates?: boolean };
  }
}
