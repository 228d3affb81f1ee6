import { useState } from "react";
import { Link } from "react-router-dom";
import { PASSWORD_MIN_LENGTH } from "@shared/schemas/invitations";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
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
        if (password.length < PASSWORD_MIN_LENGTH) return setProblem(`Choose a password of at least ${PASSWORD_MIN_LENGTH} characters.`);
        if (password !== repeat) return setProblem("The two passwords differ.");
        accept.mutate({ token, name, password }, { onError: (err) => setProblem(err.message) });
      }}
    >
      <Field label="Your name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        value={password}
        onChange={(e) => setPassword(e.target.value)}
      />
      <Field label="Password again" type="password" autoComplete="new-password" value={repeat} onChange={(e) => setRepeat(e.target.value)} />
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
