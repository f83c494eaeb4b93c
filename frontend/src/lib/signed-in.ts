import { useSyncExternalStore } from 'react';

// The session itself is an HttpOnly cookie that no script can read; this mark only says whether this browser signed in.
const STORAGE_KEY = 'meritline.signed-in';
const listeners = new Set<() => void>();
let endedByUser = false;

// Earlier versions kept the session token itself in page storage.
localStorage.removeItem('meritline.session-token');

function notify() {
  listeners.forEach((listener) => listener());
}

export function isSignedIn(): boolean {
  return localStorage.getItem(STORAGE_KEY) !== null;
}

export function markSignedIn() {
  endedByUser = false;
  localStorage.setItem(STORAGE_KEY, '1');
  notify();
}

/** `byUser`: the user signed out, rather than the server refusing the session. */
export function markSignedOut({ byUser = false } = {}) {
  if (!isSignedIn()) return;
  endedByUser = byUser;
  localStorage.removeItem(STORAGE_KEY);
  notify();
}

/** After signing out on purpose the next sign-in starts at the overview, not on the page left behind. */
export function sessionEndedByUser(): boolean {
  return endedByUser;
}

export function subscribeToSignedIn(listener: () => void) {
  listeners.add(listener);
  // Signing out in one tab signs out the others.
  const onStorage = (event: StorageEvent) => {
    if (event.key === STORAGE_KEY) listener();
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

export function useSignedIn(): boolean {
  return useSyncExternalStore(subscribeToSignedIn, isSignedIn);
}
