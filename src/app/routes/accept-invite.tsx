import { Link, useSearchParams } from "react-router-dom";
import { paths } from "@/config/paths";
import { AcceptInvitationForm } from "@/features/invitations/components/accept-invitation-form";
import { PublicLayout } from "@/app/routes/public-layout";

/** /accept-invite?token=…: the page an invitation e-mail links to. */
export function AcceptInviteRoute() {
  const [params] = useSearchParams();
  const token = params.get("token") ?? "";
  return (
    <PublicLayout
      title="Accept your invitation"
      intro="Choose the name colleagues will see and your password. The link works once and for 72 hours."
    >
      {token ? (
        <AcceptInvitationForm token={token} />
      ) : (
        <p role="alert" className="text-signal-700">
          This address has no invitation token. Open the link from the invitation e-mail again, whole.{" "}
          <Link className="underline" to={paths.auth.signIn.getHref()}>
            Sign in
          </Link>
        </p>
      )}
    </PublicLayout>
  );
}
