import { useState } from "react";
import { Link } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { NewPasswordFields, newPasswordProblem } from "@/components/ui/new-password-fields";
import { paths } from "@/config/paths";
import { useConfirmPasswordReset } from "@/features/password-reset/api/confirm-password-reset";
import { useRequestPasswordReset } from "@/features/password-reset/api/request-password-reset";

/** Step 1: the e-mail address; the link arrives by e-mail (same answer whether or not the account exists). */
export function RequestResetForm() {
  const request = useRequestPasswordReset();
  const [email, setEmail] = useState("");
  if (request.isSuccess) {
    return (
      <p role="status" className="text-ink-800">
        {request.data.message}
      </p>
    );
  }
  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        request.mutate({ email });
      }}
    >
      <Field label="E-mail address" type="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
      {request.isError ? (
        <p role="alert" className="text-sm font-semibold text-signal-700">
          {request.error.message}
        </p>
      ) : null}
      <Button type="submit" variant="accent" isLoading={request.isPending} className="w-full">
        Send me a link
      </Button>
    </form>
  );
}

/** Step 2: the new password, with the token from the e-mailed link. */
export function ChooseNewPasswordForm({ token }: { token: string }) {
  const confirm = useConfirmPasswordReset();
  const [password, setPassword] = useState("");
  const [repeat, setRepeat] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  if (confirm.isSuccess) {
    return (
      <div role="status" className="space-y-2">
        <p className="font-semibold text-steady-700">{confirm.data.message}</p>
        <Link className="font-semibold text-tide-700 underline" to={paths.auth.signIn.getHref()}>
          Go to sign-in
        </Link>
      </div>
    );
  }
  return (
    <form
      className="space-y-3"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        setProblem(null);
        const passwordProblem = newPasswordProblem(password, repeat);
        if (passwordProblem) return setProblem(passwordProblem);
        confirm.mutate({ token, password }, { onError: (err) => setProblem(err.message) });
      }}
    >
      <NewPasswordFields label="New password" password={password} repeat={repeat} onPasswordChange={setPassword} onRepeatChange={setRepeat} />
      {problem ? (
        <p role="alert" className="text-sm font-semibold text-signal-700">
          {problem}
        </p>
      ) : null}
      <Button type="submit" variant="accent" isLoading={confirm.isPending} className="w-full">
        Set the new password
      </Button>
    </form>
  );
}
