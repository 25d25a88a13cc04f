/** A labelled text input with its error message underneath. */
import { useState, type Ref } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';

import { colors, layout, radius, space, type as typeScale } from '@/constants/theme';
import { AppText } from './AppText';

interface TextFieldProps extends Omit<TextInputProps, 'style'> {
  label: string;
  /** A problem with this field; drawn with a shape and text, not colour alone. */
  error?: string;
  hint?: string;
  testID?: string;
  ref?: Ref<TextInput>;
}

export function TextField({ label, error, hint, testID, ref, onFocus, onBlur, ...input }: TextFieldProps) {
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.field}>
      <AppText variant="label" nativeID={testID ? `${testID}-label` : undefined}>
        {label}
      </AppText>
      <TextInput
        {...input}
        ref={ref}
        testID={testID}
        aria-label={label}
        aria-invalid={error ? true : undefined}
        placeholderTextColor={colors.textDisabled}
        onFocus={(event) => {
          setFocused(true);
          onFocus?.(event);
        }}
        onBlur={(event) => {
          setFocused(false);
          onBlur?.(event);
        }}
        style={[styles.input, focused && styles.inputFocused, error ? styles.inputError : null]}
      />
      {error ? (
        <AppText variant="caption" tone="error" testID={testID ? `${testID}-error` : undefined}>
          {`⊗ ${error}`}
        </AppText>
      ) : hint ? (
        <AppText variant="caption" tone="muted">
          {hint}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  input: {
    ...typeScale.body,
    color: colors.text,
    minHeight: layout.touchTarget,
    paddingHorizontal: space.md,
    backgroundColor: colors.inputBackground,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.sm,
  },
  inputFocused: {
    borderColor: colors.focusRing,
    outlineColor: colors.focusRing,
    outlineStyle: 'solid',
    outlineWidth: 1,
  },
  inputError: { borderColor: colors.error, borderWidth: 2 },
});
