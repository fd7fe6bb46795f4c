/**
 * Light or dark: the user's last choice (kept in this window's local storage), else the system's
 * preference. The theme is an attribute on <html> that the style sheet's colour variables follow.
 */
import { createStore, type Store } from './state/store';

export type Theme = 'light' | 'dark';

const STORAGE_KEY = 'setpoint-critic.theme';

function initialTheme(): Theme {
  const saved = globalThis.localStorage?.getItem(STORAGE_KEY);
  if (saved === 'light' || saved === 'dark') return saved;
  return globalThis.matchMedia?.('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
}

export const themeStore: Store<Theme> = createStore<Theme>(initialTheme());

export function applyTheme(theme: Theme): void {
  document.documentElement.dataset.theme = theme;
  document.documentElement.style.colorScheme = theme;
}

export function toggleTheme(): void {
  themeStore.set((t) => (t === 'light' ? 'dark' : 'light'));
  globalThis.localStorage?.setItem(STORAGE_KEY, themeStore.get());
}

themeStore.subscribe(() => applyTheme(themeStore.get()));
