import { Text as RNText, type TextProps } from "react-native";
import { colors, fonts, type as typeScale, type ColorRole, type TypeRole } from "../../hooks/theme";

export interface AppTextProps extends TextProps {
  size?: TypeRole;
  tone?: ColorRole;
  bold?: boolean;
  align?: "left" | "center" | "right";
}

export function Text({ size = "body", tone = "ink", bold, align, style, ...rest }: AppTextProps) {
  return (
    <RNText
      {...rest}
      style={[
        typeScale[size],
        { color: colors[tone], fontFamily: bold || size === "headline" || size === "answer" ? fonts.bold : fonts.regular, textAlign: align },
        style,
      ]}
    />
  );
}
