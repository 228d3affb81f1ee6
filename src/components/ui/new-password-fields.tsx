import { PASSWORD_MIN_LENGTH } from "@shared/schemas/invitations";
import { Field } from "@/components/ui/field";

export interface NewPasswordFieldsProps {
  /** Label of the first field; the second reads "<label> again". */
  label: string;
  password: string;
  repeat: string;
  onPasswordChange: (value: string) => void;
  onRepeatChange: (value: string) => void;
}

/** A new password and its repetition, with the length rule as the hint; the browser may offer to generate one. */
export function NewPasswordFields({ label, password, repeat, onPasswordChange, onRepeatChange }: NewPasswordFieldsProps) {
  return (
    <>
      <Field
        label={label}
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        value={password}
        onChange={(e) => onPasswordChange(e.target.value)}
      />
      <Field label={`${label} again`} type="password" autoComplete="new-password" value={repeat} onChange={(e) => onRepeatChange(e.target.value)} />
    </>
  );
}

/** What is wrong with a chosen new password and its repetition, in a sentence; null when they are fine. */
export function newPasswordProblem(password: string, repeat: string): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `Choose a password of at least ${PASSWORD_MIN_LENGTH} characters.`;
  if (password !== repeat) return "The two passwords differ.";
  return null;
}
