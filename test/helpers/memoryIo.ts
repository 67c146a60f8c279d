import type { CliIo } from "../../src/cli/CliIo.js";

/** An in-memory CliIo: files from a map, output collected. */
export function memoryIo(files: Record<string, string> = {}): CliIo & { stdout: string[]; stderr: string[]; files: Record<string, string> } {
  const stdout: string[] = [];
  const stderr: string[] = [];
  return {
    stdout,
    stderr,
    files,
    out: (t) => stdout.push(t),
    err: (t) => stderr.push(t),
    readFile: (p) => {
      const text = files[p];
      if (text === undefined) throw Object.assign(new Error(`ENOENT: ${p}`), { code: "ENOENT" });
      return text;
    },
    writeFile: (p, t) => {
      files[p] = t;
    },
    exists: (p) => p in files,
    columns: 100,
  };
}
