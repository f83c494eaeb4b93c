import { useSyncExternalStore } from 'react';

const STORAGE_KEY = 'meritline.session-token';
const listeners = new Set<() => void>();
let endedByUser = false;

function notify() {
  listeners.forEach((listener) => listener());
}

export function getSessionToken(): string | null {
  return localStorage.getItem(STORAGE_KEY);
}

export function setSessionToken(token: string) {
  endedByUser = false;
  localStorage.setItem(STORAGE_KEY, token);
  notify();
}

/** `endedByUser`: the user signed out, rather than the server refusing the token. */
export function clearSessionToken({ byUser = false } = {}) {
  if (getSessionToken() === null) return;
  endedByUser = byUser;
  localStorage.removeItem(STORAGE_KEY);
  notify();
}

/** After signing out on purpose the next sign-in starts at the overview, not on the page left behind. */
export function sessionEndedByUser(): boolean {
  return endedByUser;
}

export function subscribeToSessionToken(listener: () => void) {
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

export function useSessionToken(): string | null {
  return useSyncExternalStore(subscribeToSessionToken, getSessionToken);
}
