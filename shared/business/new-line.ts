/**
 * A new line: paid within the last day and still waiting for its proof check, the first thing a
 * maker does with an order. The workroom marks it "New" and lists it before the others that are
 * not yet due (late, due-today and at-risk lines still come first).
 */
export const NEW_LINE_HOURS = 24;

export function isNewLine(line: { state: string; paidAt: number }, now: number): boolean {
  return line.state === 'awaiting_proof' && now - line.paidAt < NEW_LINE_HOURS * 3_600_000;
}
