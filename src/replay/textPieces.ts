import type { TextSource } from "./EventLogScanner.js";

/** How many characters textPieces hands out at a time. */
export const TEXT_PIECE_CHARS = 1 << 16;

/**
 * A TextSource over a string already in memory, in pieces of TEXT_PIECE_CHARS characters (so the
 * scanner's handling of lines cut between pieces is the same as with a file).
 * Cost O(1) per piece.
 * @example
 * const next = textPieces("time,event,note", 6);
 * [next(), next(), next(), next()].join("|") // => "time,e|vent,n|ote|"
 */
export function textPieces(text: string, pieceChars: number = TEXT_PIECE_CHARS): TextSource {
  let at = 0;
  return () => {
    if (at >= text.length) return undefined;
    const piece = text.slice(at, at + pieceChars);
    at += pieceChars;
    return piece;
  };
}
