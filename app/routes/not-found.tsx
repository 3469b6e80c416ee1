import { data } from "react-router";
import { GeneralErrorBoundary } from "~/components/error-boundary";

export function loader() {
  throw data({ message: "We could not find that page. It may have moved, or the link may be mistyped." }, { status: 404 });
}

export default function NotFound() {
  return null;
}

export function ErrorBoundary() {
  return (
    <main className="mx-auto max-w-2xl p-8">
      <GeneralErrorBoundary />
    </main>
  );
}
