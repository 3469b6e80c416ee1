import { type RouteConfig, index, layout, prefix, route } from "@react-router/dev/routes";

export default [
  index("routes/home.tsx"),
  route("login", "routes/login.tsx"),
  route("logout", "routes/logout.tsx"),
  route("forgot-password", "routes/forgot-password.tsx"),
  route("reset-password/:token", "routes/reset-password.tsx"),
  route("invite/:token", "routes/invite.tsx"),
  route("studio", "routes/studio/layout.tsx", [
    index("routes/studio/home.tsx"),
    route("team", "routes/studio/team.tsx"),
    route("account", "routes/studio/account.tsx"),
    route("switch-organisation", "routes/studio/switch-organisation.tsx"),
  ]),
  ...prefix("api", [route("scale", "routes/api.scale.ts")]),
  route("dev/mail", "routes/dev.mail.tsx"),
  route("*", "routes/not-found.tsx"),
] satisfies RouteConfig;
