import { useSyncExternalStore } from 'react';

const STORAGE_KEY = 'meritline.session-token';
const listeners = new Set<() => void>();

function notify() {
  listeners.forEach((listener) => listener());
}

export function getSessionToken(): string | null {
  return localStorage.getItem(STORAGE_KEY);
}

export function setSessionToken(token: string) {
  localStorage.setItem(STORAGE_KEY, token);
  notify();
}

export function clearSessionToken() {
  if (getSessionToken() === null) return;
  localStorage.removeItem(STORAGE_KEY);
  notify();
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
