/**
 * A calculator's answer line: announced politely when it changes, said in words, and a
 * prompt (not an error) while the inputs are still empty.
 */
import { StyleSheet, Text, View } from 'react-native';
import { StatusShape } from '@/src/components/StatusShape';
import { colors, radius, space, type } from '@/src/theme';

export function Result({ text, state, testID }: { text: string; state: 'answer' | 'prompt' | 'invalid'; testID: string }) {
  return (
    <View style={[styles.box, state === 'answer' ? styles.answer : state === 'invalid' ? styles.invalid : styles.prompt]}>
      {state === 'invalid' ? <StatusShape shape="cross" color={colors.bad} /> : null}
      <Text style={[styles.text, state === 'answer' ? styles.answerText : styles.promptText]} accessibilityLiveRegion="polite" testID={testID} selectable>
        {text}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { flexDirection: 'row', alignItems: 'center', gap: space.sm, borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.sm },
  answer: { backgroundColor: colors.accentSoft },
  prompt: { backgroundColor: colors.sunken },
  invalid: { backgroundColor: colors.badSoft },
  text: { flexShrink: 1 },
  answerText: { ...type.figure, fontSize: 17, lineHeight: 24, color: colors.ink },
  promptText: { ...type.body, fontSize: 16, lineHeight: 22, color: colors.ink },
});
