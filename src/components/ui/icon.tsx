import { createElement } from 'react';
import { Platform, View, type StyleProp, type ViewStyle } from 'react-native';
import { colors } from '@/theme';
import { iconPaths, type IconName } from './icon-paths';

export type { IconName };

export interface IconProps {
  name: IconName;
  size?: number;
  color?: string;
  strokeWidth?: number;
  /** Give a label only when the icon stands alone; next to words it is decorative and hidden. */
  accessibilityLabel?: string;
  style?: StyleProp<ViewStyle>;
  testID?: string;
}

/**
 * Line icon drawn as inline SVG (no icon font to download). The web build is the shipped
 * target; a native build needs react-native-svg and renders only the reserved box until then.
 */
export function Icon({ name, size = 20, color = colors.ink, strokeWidth = 1.8, accessibilityLabel, style, testID }: IconProps) {
  const box = { width: size, height: size };
  if (Platform.OS !== 'web') return <View style={[box, style]} testID={testID} />;
  const svg = createElement(
    'svg',
    {
      width: size,
      height: size,
      viewBox: '0 0 24 24',
      fill: 'none',
      stroke: color,
      strokeWidth,
      strokeLinecap: 'round',
      strokeLinejoin: 'round',
      focusable: 'false',
      'aria-hidden': accessibilityLabel ? undefined : true,
      role: accessibilityLabel ? 'img' : undefined,
      'aria-label': accessibilityLabel,
      style: { display: 'block' },
    },
    iconPaths[name].map((d) => createElement('path', { key: d, d })),
  );
  return (
    <View style={[box, style]} testID={testID}>
      {svg}
    </View>
  );
}
