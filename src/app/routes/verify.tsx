import { useParams } from "react-router-dom";
import { CodeCheck } from "@/features/summaries/components/code-check";
import { PublicLayout } from "@/app/routes/public-layout";

/** /verify/:code — the public page a signed summary's PDF points to: no account needed. */
export function VerifyRoute() {
  const { code } = useParams();
  return (
    <PublicLayout
      title="Check a signed summary"
      intro="Enter the verification code printed on the PDF. The summary on record is checked against the server's published keys, here and in your browser."
      wide
    >
      <CodeCheck key={code ?? ""} code={code ?? null} />
    </PublicLayout>
  );
}
