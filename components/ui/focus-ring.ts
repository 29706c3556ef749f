import { Platform } from 'react-native';
import { colors } from './theme';

/**
 * A keyboard focus ring on every control of the web app (WCAG 2.2 SC 2.4.7), in one rule rather than
 * in every Pressable: the accent outline on light grounds, the rail's ink on the dark rail. Shown for
 * keyboard focus only (:focus-visible), so a tap or a click leaves no ring behind.
 */
export function installFocusRing(): void {
  if (Platform.OS !== 'web' || typeof document === 'undefined') return;
  if (document.getElementById('sphereline-focus-ring')) return;
  const element = document.createElement('style');
  element.id = 'sphereline-focus-ring';
  document.head.appendChild(element);
  const sheet = element.sheet;
  if (!sheet) return;
  sheet.insertRule(`:focus-visible { outline: 3px solid ${colors.accent} !important; outline-offset: 2px !important; }`, 0);
  sheet.insertRule(`[data-testid="nav-rail"] :focus-visible { outline-color: ${colors.railInk} !important; }`, 1);
}
