import type { QueryClient } from "@tanstack/react-query";
import { Link, redirect, useNavigate, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { CautionsLine } from "@/components/ui/cautions";
import { Wordmark } from "@/components/ui/logo";
import { paths, safeRedirectTarget } from "@/config/paths";
import { getMeQueryOptions } from "@/features/auth/api/get-me";
import { SignInFigure } from "@/features/auth/components/sign-in-figure";
import { SignInForm } from "@/features/auth/components/sign-in-form";
import { homeHref } from "@/app/routes/guards";

/** Someone already signed in goes straight on. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = await queryClient.ensureQueryData(getMeQueryOptions());
    if (me) {
      const target = safeRedirectTarget(new URL(request.url).searchParams.get("redirectTo"));
      throw redirect(target ?? homeHref(me));
    }
    return null;
  };

export function SignInRoute() {
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const redirectTo = safeRedirectTarget(searchParams.get("redirectTo"));

  return (
    <div className="flex min-h-dvh flex-col lg:flex-row">
      <aside className="on-ink flex flex-col justify-between gap-4 bg-ink-900 px-6 py-5 text-ink-200 lg:w-[42%] lg:max-w-xl lg:px-10 lg:py-10">
        <Wordmark />
        <div className="space-y-5">
          <SignInFigure className="hidden w-full max-w-sm lg:block" />
          <p className="max-w-xl text-ink-100 lg:max-w-sm lg:text-lg lg:leading-snug">
            Aeroelastic stability of long-span bridge decks: flutter and divergence speeds, studied revision by
            revision, compared across deck alternatives and signed by the reviewing engineer.
          </p>
        </div>
        <p className="hidden text-xs text-ink-300 lg:block">Access is by invitation from your project’s administrator.</p>
      </aside>
      <main className="flex flex-1 flex-col">
        <div className="flex flex-1 items-center justify-center px-6 py-10">
          <div className="w-full max-w-sm">
            <h1 className="mb-1 text-2xl font-semibold">Sign in</h1>
            <p className="mb-5 text-ink-700">Use the e-mail address your project administrator registered.</p>
            <SignInForm onSuccess={(user) => navigate(redirectTo ?? homeHref(user), { replace: true })} />
            <p className="mt-4 text-sm">
              <Link className="text-tide-700 underline-offset-2 hover:underline" to={paths.auth.resetPassword.getHref()}>
                Forgot your password?
              </Link>
            </p>
          </div>
        </div>
        <footer className="border-t border-ink-200 px-6 py-2">
          <CautionsLine />
        </footer>
      </main>
    </div>
  );
}
