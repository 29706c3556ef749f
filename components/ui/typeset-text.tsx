import { Platform, StyleSheet, Text } from 'react-native';
import { typesetRuns } from '@/lib/chem/number-format';
import { AppText, type AppTextProps } from './text';

/**
 * Running text with the orbital labels typeset as the trade prints them (t₂g, e_g: the "2g" and "g"
 * lowered and smaller; Unicode has no subscript g). The words themselves are unchanged, so a screen
 * reader and a copy-paste read "t2g" and "eg".
 */
export function TypesetText({ children, ...rest }: Omit<AppTextProps, 'children'> & { children: string }) {
  const runs = typesetRuns(children);
  if (runs.length <= 1 && runs[0]?.kind !== 'sub') return <AppText {...rest}>{runs[0]?.text ?? ''}</AppText>;
  return (
    <AppText {...rest}>
      {runs.map((run, index) =>
        run.kind === 'sub' ? (
          <Text key={index} style={styles.sub}>
            {run.text}
          </Text>
        ) : (
          run.text
        ),
      )}
    </AppText>
  );
}

const styles = StyleSheet.create({
  // On the web a nested Text is a span: vertical-align lowers it without changing the line height.
  sub: Platform.select({
    web: { fontSize: '0.78em', verticalAlign: 'sub' } as unknown as object,
    default: { fontSize: 11 },
  }) as object,
});
