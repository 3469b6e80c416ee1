import "@fontsource/literata/400.css";
import "@fontsource/literata/600.css";
import "@fontsource/literata/400-italic.css";
import "@fontsource/ibm-plex-sans/400.css";
import "@fontsource/ibm-plex-sans/600.css";
import "./styles/app.css";
import { Links, Meta, Outlet, Scripts, ScrollRestoration, useMatches, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/root";
import { GeneralErrorBoundary } from "./components/error-boundary";

export function loader({ context }: Route.LoaderArgs) {
  return { nonce: context.cspNonce };
}

export const meta: Route.MetaFunction = () => [
  { title: "Eonscale" },
  { name: "description", content: "Plan, check and publish exhibits that turn geologic time into distance." },
];

/**
 * A route whose `handle` says `{ visitor: true }` is a static visitor page (app/routes/visit.*):
 * rendered without hydration (no <Scripts/>, no inline script), in the language its loader chose
 * (`htmlLang` in its data).
 */
function useVisitorPage(): { htmlLang: string } | null {
  const leaf = useMatches().at(-1);
  if (!(leaf?.handle as { visitor?: boolean } | undefined)?.visitor) return null;
  return { htmlLang: (leaf?.data as { htmlLang?: string } | undefined)?.htmlLang ?? "en" };
}

function Head() {
  return (
    <head>
      <meta charSet="utf-8" />
      <meta name="viewport" content="width=device-width, initial-scale=1" />
      <link rel="icon" href="/favicon.svg" type="image/svg+xml" />
      <Meta />
      <Links />
    </head>
  );
}

export function Layout({ children }: { children: React.ReactNode }) {
  const data = useRouteLoaderData<typeof loader>("root");
  const nonce = data?.nonce;
  const visitor = useVisitorPage();
  if (visitor) {
    return (
      <html lang={visitor.htmlLang}>
        <Head />
        <body className="visit">{children}</body>
      </html>
    );
  }
  return (
    <html lang="en-GB">
      <Head />
      <body className="min-h-screen bg-paper text-ink antialiased">
        {children}
        <ScrollRestoration nonce={nonce} />
        <Scripts nonce={nonce} />
      </body>
    </html>
  );
}

export default function App() {
  return <Outlet />;
}

export function ErrorBoundary() {
  return (
    <main className="mx-auto max-w-2xl p-8">
      <GeneralErrorBoundary />
    </main>
  );
}
