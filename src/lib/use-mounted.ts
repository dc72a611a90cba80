import { type RefObject, useEffect, useState } from 'react';

/**
 * false on the server and in the browser's first (hydrating) render, true once mounted: for parts
 * that must not be in the server's HTML or that should load only after the first paint.
 */
export function useMounted(): boolean {
  const [mounted, setMounted] = useState(false);
  useEffect(() => setMounted(true), []);
  return mounted;
}

// Has the person done anything on this page yet (tapped, clicked, typed, scrolled)? Set once, for
// the whole visit: after the first page, every page is opened by the person's own action.
let interacted = false;
const INTERACTIONS = ['pointerdown', 'keydown', 'touchstart', 'wheel', 'scroll'] as const;
const waiting = new Set<() => void>();
function onInteraction() {
  interacted = true;
  for (const w of waiting) w();
  waiting.clear();
  for (const type of INTERACTIONS) window.removeEventListener(type, onInteraction, true);
}
if (typeof window !== 'undefined') for (const type of INTERACTIONS) window.addEventListener(type, onInteraction, { capture: true, passive: true });

/** how long after the page has loaded a part that is still not wanted loads anyway, ms */
const SETTLED_MS = 3000;

/**
 * For heavy parts below the first screen (the personaliser and its font engine): false on the server
 * and in the first render; true once the element comes on screen, as soon as the person has
 * interacted with the page at all (so a page opened from a link inside the app gets it at once), or
 * a few seconds after the page has loaded, whichever comes first.
 */
export function useWantedSoon(ref: RefObject<Element | null>, rootMargin = '0px'): boolean {
  const [wanted, setWanted] = useState(false);
  useEffect(() => {
    if (interacted) return setWanted(true);
    const show = () => setWanted(true);
    waiting.add(show);
    const el = ref.current;
    const observer = el && typeof IntersectionObserver !== 'undefined' ? new IntersectionObserver((entries) => entries.some((e) => e.isIntersecting) && show(), { rootMargin }) : null;
    if (el) observer?.observe(el);
    if (!observer) show();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const settle = () => {
      timer = setTimeout(show, SETTLED_MS);
    };
    if (document.readyState === 'complete') settle();
    else window.addEventListener('load', settle, { once: true });
    return () => {
      waiting.delete(show);
      observer?.disconnect();
      clearTimeout(timer);
      window.removeEventListener('load', settle);
    };
  }, [ref, rootMargin]);
  return wanted;
}
