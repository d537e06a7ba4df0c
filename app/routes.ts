import { type RouteConfig, index, layout, prefix, route } from "@react-router/dev/routes";

export default [
  route("healthz", "routes/healthz.ts"),
  layout("routes/shell.tsx", [
    index("routes/home.tsx"),
    ...prefix("robots", [index("routes/robots/list.tsx")]),
    ...prefix("gaits", [index("routes/gaits/list.tsx")]),
    route("reviews", "routes/reviews.tsx"),
    route("settings", "routes/settings.tsx"),
    route("*", "routes/not-found.tsx"),
  ]),
] satisfies RouteConfig;
