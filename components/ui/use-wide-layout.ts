import { useWindowDimensions } from 'react-native';
import { WIDE_BREAKPOINT_PX } from './theme';

/** True on screens wide enough for the side rail and two-column layouts. */
export function useWideLayout(): boolean {
  const { width } = useWindowDimensions();
  return width >= WIDE_BREAKPOINT_PX;
}
