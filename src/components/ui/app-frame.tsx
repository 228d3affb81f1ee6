import type { ReactNode } from "react";
import { Link, NavLink } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { CautionsLine } from "@/components/ui/cautions";
import { Wordmark } from "@/components/ui/logo";
import { paths } from "@/config/paths";
import { cn } from "@/lib/cn";

export interface NavItem {
  to: string;
  label: string;
  /** Match the path exactly rather than as a prefix. */
  end?: boolean;
}

interface AppFrameProps {
  navItems: readonly NavItem[];
  user: { name: string; email: string; standing: string };
  onSignOut: () => void;
  isSigningOut?: boolean;
  /** A route change is loading: shows a thin progress line under the header. */
  isNavigating?: boolean;
  children: ReactNode;
}

/**
 * The frame around every signed-in screen: one dark header row (mark, the sections this user may open, who
 * is signed in), the content at full width for plots and tables, and the cautions line at the foot.
 */
export function AppFrame({ navItems, user, onSignOut, isSigningOut, isNavigating, children }: AppFrameProps) {
  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only z-50 rounded-md bg-white px-3 py-2 font-semibold text-ink-900 focus:not-sr-only focus:absolute focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      <header className="on-ink relative bg-ink-900 text-ink-100">
        <div className="flex flex-wrap items-center gap-x-6 gap-y-1 px-4 py-1.5 md:px-6">
          <Link to={paths.home.getHref()} aria-label="Stillspan, start page" className="flex items-center rounded-md">
            <Wordmark />
          </Link>
          <nav aria-label="Main" className="order-3 w-full md:order-none md:w-auto">
            <ul className="flex gap-1">
              {navItems.map((item) => (
                <li key={item.to}>
                  <NavLink
                    to={item.to}
                    end={item.end}
                    className={({ isActive }) =>
                      cn(
                        "relative block rounded-md px-3 py-1.5 text-[0.95rem] font-semibold transition-colors",
                        isActive
                          ? "bg-ink-800 text-white after:absolute after:inset-x-3 after:-bottom-1.5 after:h-0.5 after:bg-tide-500"
                          : "text-ink-300 hover:bg-ink-800 hover:text-white",
                      )
                    }
                  >
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="ml-auto flex items-center gap-3">
            <div className="text-right leading-tight">
              <p className="text-sm font-semibold text-white" title={user.email}>
                {user.name}
              </p>
              <p className="text-xs text-ink-300">{user.standing}</p>
            </div>
            <Button
              variant="inverse"
              size="sm"
              onClick={onSignOut}
              isLoading={isSigningOut}
            >
              Sign out
            </Button>
          </div>
        </div>
        <div
          aria-hidden="true"
          className={cn(
            "absolute inset-x-0 bottom-0 h-0.5 origin-left bg-tide-500 transition-transform duration-500",
            isNavigating ? "scale-x-75" : "scale-x-0",
          )}
        />
      </header>
      <main id="main" tabIndex={-1} className="flex-1 px-4 py-5 outline-none md:px-6">
        {children}
      </main>
      <footer className="border-t border-ink-200 bg-surface px-4 py-2 md:px-6">
        <CautionsLine />
      </footer>
    </div>
  );
}
