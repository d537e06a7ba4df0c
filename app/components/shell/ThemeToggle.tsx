import { useEffect, useState } from "react";
import { type Theme, themeCookie } from "~/platform/theme";

export function ThemeToggle() {
  const [theme, setTheme] = useState<Theme>("light");
  useEffect(() => setTheme(document.documentElement.classList.contains("dark") ? "dark" : "light"), []);

  function toggle() {
    const next: Theme = theme === "dark" ? "light" : "dark";
    document.documentElement.classList.toggle("dark", next === "dark");
    document.cookie = themeCookie(next);
    setTheme(next);
  }

  return (
    <button
      type="button"
      onClick={toggle}
      className="rounded-md px-2 py-1 text-sm text-ink-muted hover:bg-sunken hover:text-ink"
      aria-label={theme === "dark" ? "Use the light theme" : "Use the dark theme"}
    >
      {theme === "dark" ? "Light" : "Dark"}
    </button>
  );
}
