import { createBrowserRouter, RouterProvider } from "react-router-dom";
import { AppLayout } from "./app-layout";
import { ErrorState } from "@/components/ui/states";
import { AcceptInvitationRoute } from "./routes/accept-invitation";
import { HomeRoute } from "./routes/home";
import { NotFoundRoute } from "./routes/not-found";
import { ResetPasswordRoute } from "./routes/reset-password";
import { SignInRoute } from "./routes/sign-in";
import { SignUpRoute } from "./routes/sign-up";
import { VerifyEmailRoute } from "./routes/verify-email";

function RouteError() {
  return (
    <div className="mx-auto max-w-lg p-8">
      <ErrorState error={new Error("This screen failed to load. Reload the page to try again.")} title="Something went wrong" />
    </div>
  );
}

// Screens that typeset, plot or read netlists load on first visit, so the first page stays small.
const router = createBrowserRouter([
  {
    element: <AppLayout />,
    errorElement: <RouteError />,
    children: [
      { path: "/", element: <HomeRoute /> },
      { path: "/sign-in", element: <SignInRoute /> },
      { path: "/sign-up", element: <SignUpRoute /> },
      { path: "/reset-password", element: <ResetPasswordRoute /> },
      { path: "/verify-email", element: <VerifyEmailRoute /> },
      { path: "/invitations/accept", element: <AcceptInvitationRoute /> },
      { path: "/api-reference", lazy: async () => ({ Component: (await import("./routes/api-reference")).ApiReferenceRoute }) },
      { path: "/account", lazy: async () => ({ Component: (await import("./routes/account")).AccountRoute }) },
      { path: "/reviews/awaiting", lazy: async () => ({ Component: (await import("./routes/reviews")).AwaitingReviewRoute }) },
      { path: "/reviews/mine", lazy: async () => ({ Component: (await import("./routes/reviews")).MyRevisionsInReviewRoute }) },
      { path: "/teams", lazy: async () => ({ Component: (await import("./routes/teams")).TeamsRoute }) },
      { path: "/teams/:teamId", lazy: async () => ({ Component: (await import("./routes/team")).TeamRoute }) },
      { path: "/networks/:networkId", handle: { wide: true }, lazy: async () => ({ Component: (await import("./routes/workbench")).WorkbenchRoute }) },
      { path: "/networks/:networkId/r/:number", handle: { wide: true }, lazy: async () => ({ Component: (await import("./routes/workbench")).WorkbenchRoute }) },
      { path: "/networks/:networkId/history", lazy: async () => ({ Component: (await import("./routes/revision-history")).RevisionHistoryRoute }) },
      { path: "/n/:slug/r/:number", lazy: async () => ({ Component: (await import("./routes/workbench")).PermalinkRoute }) },
      { path: "/s/:token", handle: { wide: true }, lazy: async () => ({ Component: (await import("./routes/shared-view")).SharedViewRoute }) },
      { path: "/how-results-are-checked", lazy: async () => ({ Component: (await import("./routes/how-results-are-checked")).HowResultsAreCheckedRoute }) },
      { path: "*", element: <NotFoundRoute /> },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
