import { createBrowserRouter, RouterProvider } from "react-router-dom";
import { AppLayout } from "@/components/ui/app-layout";
import { HomeRoute } from "./routes/home";
import { NotFoundRoute } from "./routes/not-found";
import { SignInRoute } from "./routes/sign-in";

const router = createBrowserRouter([
  {
    element: <AppLayout />,
    children: [
      { path: "/", element: <HomeRoute /> },
      { path: "/sign-in", element: <SignInRoute /> },
      { path: "*", element: <NotFoundRoute /> },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
