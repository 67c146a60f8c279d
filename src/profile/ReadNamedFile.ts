/**
 * Reads a file named in a profile (a network or a power-trace CSV), path as written. The CLI
 * supplies it. An optional `displayName` gives the name messages should show for such a file
 * (the CLI resolves it against the profile's folder).
 */
export type ReadNamedFile = ((path: string) => string) & { readonly displayName?: (path: string) => string };
