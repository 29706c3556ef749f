import { Text, type TextProps, StyleSheet } from 'react-native';
import { colors, fonts, typeScale } from './theme';

type Variant = 'caption' | 'body' | 'lead' | 'title' | 'display' | 'label' | 'mono';

export interface AppTextProps extends TextProps {
  variant?: Variant;
  tone?: 'ink' | 'soft' | 'muted' | 'accent' | 'danger' | 'inverse';
}

export function AppText({ variant = 'body', tone = 'ink', style, ...rest }: AppTextProps) {
  return <Text style={[styles.base, variantStyles[variant], toneStyles[tone], style]} {...rest} />;
}

const styles = StyleSheet.create({ base: { fontFamily: fonts.body, color: colors.ink } });

const variantStyles = StyleSheet.create({
  caption: typeScale.caption,
  body: typeScale.body,
  lead: typeScale.lead,
  title: { ...typeScale.title, fontFamily: fonts.strong },
  display: { ...typeScale.display, fontFamily: fonts.strong, letterSpacing: -0.5 },
  label: { ...typeScale.caption, fontFamily: fonts.strong, letterSpacing: 0.6, textTransform: 'uppercase' },
  mono: { ...typeScale.body, fontFamily: fonts.mono },
});

const toneStyles = StyleSheet.create({
  ink: { color: colors.ink },
  soft: { color: colors.inkSoft },
  muted: { color: colors.muted },
  accent: { color: colors.accent },
  danger: { color: colors.danger },
  inverse: { color: colors.railInk },
});
