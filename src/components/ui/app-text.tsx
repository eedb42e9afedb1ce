import { Text, type TextProps } from 'react-native';
import { colors, type as typeScale, type TypeVariant } from '@/theme';

const toneColour = {
  default: undefined,
  soft: colors.inkSoft,
  faint: colors.inkFaint,
  go: colors.go,
  due: colors.due,
  irreversible: colors.irreversible,
  onColour: colors.onColour,
} as const;
export type TextTone = keyof typeof toneColour;

export interface AppTextProps extends TextProps {
  /** Type scale entry from the theme; `mono*` variants for codes and figures. */
  variant?: TypeVariant;
  tone?: TextTone;
  align?: 'left' | 'center' | 'right';
}

/** Text in the app's type scale. Use instead of bare <Text> so fonts and colours stay consistent. */
export function AppText({ variant = 'body', tone = 'default', align, style, ...rest }: AppTextProps) {
  const colour = toneColour[tone];
  return <Text {...rest} style={[typeScale[variant], colour ? { color: colour } : null, align ? { textAlign: align } : null, style]} />;
}
