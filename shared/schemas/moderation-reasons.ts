/**
 * Reasons a moderator most often sends a listing back for changes, ready to pick and then edit. The
 * words match what the seller reads: the button says "Send back for changes", the e-mail "Changes
 * needed", and the reason itself is the text below (or the moderator's own).
 */
export const LISTING_CHANGE_REASONS: readonly { short: string; text: string }[] = [
  { short: 'Photo', text: 'Add a clear photo of the finished item on its blank, so shoppers see what arrives.' },
  { short: 'Description vs preview', text: 'The description says something the preview does not show. Make the words and the preview agree.' },
  { short: 'Artwork rights', text: 'The motif looks like artwork the shop may not have the rights to. Use artwork you made or may sell, and say so in the description.' },
  { short: 'Price', text: 'The base price or the extra-layer price does not fit the design offered. Check both prices.' },
  { short: 'Small parts', text: 'The item has small decorations: tick the small-parts box so shoppers see the safety note.' },
];
