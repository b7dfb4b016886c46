/**
 * Text in one of the theme's type styles.
 */
import { Text as NativeText, type TextProps } from 'react-native';
import { type } from './theme';

export type TextVariant = keyof typeof type;

/**
 * Renders `children` in the type style `variant` (default `body`); extra `style` is applied on top.
 * `heading` sets the accessibility role so screen readers and browser tests can find page headings.
 */
export function Text({
  variant = 'body',
  heading,
  style,
  ...rest
}: TextProps & { variant?: TextVariant; heading?: 1 | 2 | 3 }) {
  return (
    <NativeText
      {...rest}
      role={heading ? 'heading' : rest.role}
      aria-level={heading}
      style={[type[variant], style]}
    />
  );
}
