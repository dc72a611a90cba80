import { useEffect, useState } from 'react';

/**
 * false on the server and in the browser's first (hydrating) render, true once mounted: for parts
 * that must not be in the server's HTML or that should load only after the first paint.
 */
export function useMounted(): boolean {
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  return mounted;
}
