import type { ComponentType } from "react";
import { createBrowserRouter, RouterProvider, type RouteObject } from "react-router";
import type { Role } from "./api/types";
import { RouteError } from "./components/ErrorBoundary";
import { HomeRedirect } from "./components/HomeRedirect";
import { RequireRole } from "./components/RequireRole";
import { LiveUpdates } from "./features/live/LiveUpdates";
import SignIn from "./routes/SignIn";

type ScreenModule = { default: ComponentType };

// Role screens load on first visit, so signing in on a tablet fetches only what it needs.
function screen(load: () => Promise<ScreenModule>): RouteObject["lazy"] {
  return async () => ({ Component: (await load()).default });
}

function roleArea(role: Role, children: RouteObject[]): RouteObject {
  return { element: <RequireRole role={role} />, children };
}

const routes: RouteObject[] = [
  { path: "/sign-in", element: <SignIn />, errorElement: <RouteError /> },
  {
    path: "/",
    // The signed-in shell loads after sign-in, keeping the sign-in page's first load small.
    lazy: async () => ({ Component: (await import("./components/AppShell")).AppShell }),
    errorElement: <RouteError />,
    children: [
      { index: true, element: <HomeRedirect /> },
      { path: "change-password", lazy: screen(() => import("./routes/ChangePassword")) },
      // Master data: everyone signed in may read; each screen offers actions per role.
      { path: "vessels", lazy: screen(() => import("./routes/Vessels")) },
      { path: "rate-models", lazy: screen(() => import("./routes/RateModels")) },
      { path: "rate-models/new", lazy: screen(() => import("./routes/RateModelNew")) },
      { path: "rate-models/versions/:versionId", lazy: screen(() => import("./routes/RateModelVersion")) },
      { path: "rate-models/versions/:versionId/update", lazy: screen(() => import("./routes/ModelUpdate")) },
      { path: "rate-models/:modelId/compare", lazy: screen(() => import("./routes/RateModelCompare")) },
      { path: "master-records", lazy: screen(() => import("./routes/MasterRecords")) },
      { path: "master-records/new", lazy: screen(() => import("./routes/MasterRecordNew")) },
      { path: "master-records/versions/:versionId", lazy: screen(() => import("./routes/MasterRecordVersion")) },
      { path: "campaigns", lazy: screen(() => import("./routes/Campaigns")) },
      { path: "campaigns/:campaignId", lazy: screen(() => import("./routes/CampaignDetail")) },
      { path: "campaigns/:campaignId/trends", lazy: screen(() => import("./routes/CampaignTrends")) },
      { path: "analysis", lazy: screen(() => import("./routes/KineticsAnalysis")) },
      // Batch execution: everyone signed in may read; actions follow the person's roles.
      { path: "batches", lazy: screen(() => import("./routes/Batches")) },
      { path: "batches/:id", lazy: screen(() => import("./routes/BatchPage")) },
      { path: "batches/:id/review", lazy: screen(() => import("./routes/BatchReview")) },
      { path: "deviations", lazy: screen(() => import("./routes/Deviations")) },
      // Training: everyone sees their own; admins and supervisors record, quality reads all.
      { path: "training", lazy: screen(() => import("./routes/Training")) },
      roleArea("operator", [{ path: "operator", lazy: screen(() => import("./routes/OperatorHome")) }]),
      roleArea("supervisor", [{ path: "supervisor", lazy: screen(() => import("./routes/SupervisorHome")) }]),
      roleArea("quality", [{ path: "quality", lazy: screen(() => import("./routes/QualityHome")) }]),
      roleArea("engineer", [{ path: "engineer", lazy: screen(() => import("./routes/EngineerHome")) }]),
      roleArea("admin", [
        { path: "admin", lazy: screen(() => import("./routes/AdminHome")) },
        { path: "admin/people", lazy: screen(() => import("./routes/AdminPeople")) },
        { path: "admin/mail", lazy: screen(() => import("./routes/AdminMail")) },
      ]),
    ],
  },
  { path: "*", lazy: screen(() => import("./routes/NotFound")), errorElement: <RouteError /> },
];

/** The app's router: sign-in, the signed-in shell with each role's screens, and a 404. */
export const router = createBrowserRouter(routes);

/** The routed app. */
export default function App() {
  return (
    <LiveUpdates>
      <RouterProvider router={router} />
    </LiveUpdates>
  );
}
