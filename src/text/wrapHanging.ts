import { wrapText } from "./cautions.js";

/**
 * Wrap one line of a report to a width, keeping its leading spaces and indenting the lines it
 * continues on by two more (a hanging indent), so a long sentence under a heading stays readable
 * as a block. A line within the width is returned as it is. Units stay on the line of their
 * number (wrapText).
 * Cost O(length of the line).
 */
export function wrapHanging(line: string, width: number): string {
  if ([...line].length <= width) return line;
  const lead = /^ */.exec(line)![0].length;
  const body = wrapText(line.slice(lead), Math.max(20, width - lead - 2)).split("\n");
  return body.map((l, i) => `${" ".repeat(i === 0 ? lead : lead + 2)}${l}`).join("\n");
}
