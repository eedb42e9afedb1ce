import { useWindowDimensions } from 'react-native';
import { layout } from './index';

/** True at >= 1024 px: side rail instead of bottom tabs, list + detail side by side. */
export function useWide(): boolean {
  return useWindowDimensions().width >= layout.wide;
}
