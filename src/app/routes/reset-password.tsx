import { Link, useSearchParams } from "react-router-dom";
import { paths } from "@/config/paths";
import { ChooseNewPasswordForm, RequestResetForm } from "@/features/password-reset/components/password-reset-forms";
import { PublicLayout } from "@/app/routes/public-layout";

/** /reset-password: ask for a link; /reset-password?token=…: choose the new password. */
export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const token = params.get("token");
  return (
    <PublicLayout
      title={token ? "Choose a new password" : "Reset your password"}
      intro={
        token
          ? "The link works once and for 72 hours."
          : "Enter the address you sign in with. If it has an account, a one-time link to choose a new password is e-mailed to it."
      }
    >
      {token ? <ChooseNewPasswordForm token={token} /> : <RequestResetForm />}
      <p className="mt-4 text-sm">
        <Link className="text-tide-700 underline" to={paths.auth.signIn.getHref()}>
          Back to sign-in
        </Link>
      </p>
    </PublicLayout>
  );
}
