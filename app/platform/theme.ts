// The light/dark choice, kept in a cookie so the server renders the right theme.
export type Theme = "light" | "dark";

export const THEME_COOKIE = "gaitloom-theme";

export function readTheme(cookieHeader: string | null): Theme {
  const match = cookieHeader?.match(new RegExp(`(?:^|;\\s*)${THEME_COOKIE}=(light|dark)`));
  return match?.[1] === "dark" ? "dark" : "light";
}

export function themeCookie(theme: Theme): string {
  return `${THEME_COOKIE}=${theme}; Path=/; Max-Age=31536000; SameSite=Lax`;
}
