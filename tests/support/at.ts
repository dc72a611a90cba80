/**
 * The element at index `i` of a list (negative counts from the end, as Array.prototype.at), for
 * tests that read into a result: a missing element fails the test here, naming the index and the
 * length, instead of as a TypeError further on.
 */
export function at<T>(list: { readonly length: number; at(i: number): T | undefined }, i: number): T {
  const v = list.at(i);
  if (v === undefined) throw new Error(`Expected an element at index ${i}, but the list has ${list.length}.`);
  return v;
}
