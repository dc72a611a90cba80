/**
 * A material as people read it: its colour name with its kind in brackets, "Ink navy (smooth)", unless
 * the colour name already says the kind ("Pine flock", "Marigold glitter"), which then stands alone
 * rather than "Pine flock flock". Every label of a material in a message, table or e-mail comes from here.
 */
export function materialLabel(m: { colourName: string; kind: string }): string {
  const kind = m.kind.trim().toLowerCase();
  const saysKind = kind !== '' && new RegExp(`(^|\\s)${kind.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(\\s|$)`, 'i').test(m.colourName);
  return saysKind ? m.colourName : `${m.colourName} (${m.kind})`;
}
