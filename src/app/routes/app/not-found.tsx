import { Link } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { paths } from "@/config/paths";

export function NotFoundRoute() {
  return (
    <div className="mx-auto max-w-xl py-6">
      <Card title="Page not found">
        <p className="text-ink-700">
          There is no page at this address.{" "}
          <Link to={paths.home.getHref()} className="text-tide-700 hover:underline">
            Go to the start page
          </Link>
          .
        </p>
      </Card>
    </div>
  );
}
