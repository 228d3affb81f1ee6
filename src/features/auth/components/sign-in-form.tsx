import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field } from "@/components/ui/field";
import { ApiError } from "@/lib/api-client";
import type { User } from "@/types/api";
import { signInInputSchema, useSignIn, type SignInInput } from "@/features/auth/api/sign-in";

/** Turns a failed sign-in into a sentence; the server's 401 is deliberately the same for e-mail and password. */
function describeSignInError(error: unknown): { title: string; message: string; code?: string } {
  if (error instanceof ApiError) {
    if (error.status === 401) {
      return { title: "Not signed in", message: "The e-mail address or the password is not correct." };
    }
    if (error.status === 429) {
      return { title: "Too many attempts", message: "Sign-in is paused for this address for a while. Wait a minute, then try again." };
    }
    return { title: "Sign-in failed", message: error.message, code: error.code };
  }
  return { title: "Sign-in failed", message: "An unexpected error stopped the sign-in. Try again." };
}

export function SignInForm({ onSuccess }: { onSuccess: (user: User) => void }) {
  const signIn = useSignIn({ onSuccess });
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<SignInInput>({
    resolver: zodResolver(signInInputSchema),
    defaultValues: { email: "", password: "" },
  });

  const failure = signIn.isError ? describeSignInError(signIn.error) : null;

  return (
    <form
      noValidate
      aria-label="Sign in"
      className="space-y-4"
      onSubmit={handleSubmit((values) => signIn.mutate(values))}
    >
      {failure ? <ErrorPanel title={failure.title} message={failure.message} code={failure.code} /> : null}
      <Field
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        spellCheck={false}
        autoFocus
        error={errors.email?.message}
        {...register("email")}
      />
      <Field
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register("password")}
      />
      <Button type="submit" variant="primary" className="w-full" isLoading={signIn.isPending}>
        Sign in
      </Button>
    </form>
  );
}
