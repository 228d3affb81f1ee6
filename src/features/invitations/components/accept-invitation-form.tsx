import { useState } from "react";
import { Link } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { NewPasswordFields, newPasswordProblem } from "@/components/ui/new-password-fields";
import { paths } from "@/config/paths";
import { useAcceptInvitation } from "@/features/invitations/api/accept-invitation";

/** Name and password for an invited person; the token comes from the e-mailed link. */
export function AcceptInvitationForm({ token }: { token: string }) {
  const accept = useAcceptInvitation();
  const [name, setName] = useState("");
  const [password, setPassword] = useState("");
  const [repeat, setRepeat] = useState("");
  const [problem, setProblem] = useState<string | null>(null);

  if (accept.isSuccess) {
    return (
      <div role="status" className="space-y-2">
        <p className="font-semibold text-steady-700">Your account is ready.</p>
        <p className="text-ink-700">
          Sign in as <span className="font-semibold">{accept.data.email}</span> with the password you chose.
        </p>
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
        if (!name.trim()) return setProblem("Enter your name as colleagues should see it.");
        const passwordProblem = newPasswordProblem(password, repeat);
        if (passwordProblem) return setProblem(passwordProblem);
        accept.mutate({ token, name, password }, { onError: (err) => setProblem(err.message) });
      }}
    >
      <Field label="Your name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} />
      <NewPasswordFields label="Password" password={password} repeat={repeat} onPasswordChange={setPassword} onRepeatChange={setRepeat} />
      {problem ? (
        <p role="alert" className="text-sm font-semibold text-signal-700">
          {problem}
        </p>
      ) : null}
      <Button type="submit" variant="accent" isLoading={accept.isPending} className="w-full">
        Accept the invitation
      </Button>
    </form>
  );
}
