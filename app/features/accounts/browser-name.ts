// A name for a browser that its owner recognises in the list of their
// sessions ("Firefox on Windows"), read from its user agent. A label, not
// detection: nothing is decided by it, so a few patterns are enough.
const BROWSERS: [RegExp, string][] = [
  [/\bEdg(A|iOS)?\//, "Edge"],
  [/\bOPR\/|\bOpera\b/, "Opera"],
  [/\bFirefox\/|\bFxiOS\//, "Firefox"],
  [/\bChromium\//, "Chromium"],
  // HeadlessChrome too: Chrome driven by a script (a test, a crawler) is still Chrome.
  [/Chrome\/|\bCriOS\//, "Chrome"],
  [/\bVersion\/[\d.]+.*\bSafari\//, "Safari"],
];

const SYSTEMS: [RegExp, string][] = [
  [/\b(iPhone|iPad|iPod)\b/, "iOS"],
  [/\bAndroid\b/, "Android"],
  [/\bCrOS\b/, "ChromeOS"],
  [/\bWindows\b/, "Windows"],
  [/\bMac OS X\b|\bMacintosh\b/, "macOS"],
  [/\bLinux\b/, "Linux"],
];

const LIMIT = 60;

export function browserName(userAgent: string | null | undefined): string {
  const agent = userAgent?.trim() ?? "";
  if (!agent) return "Unknown browser";
  const browser = BROWSERS.find(([pattern]) => pattern.test(agent))?.[1];
  const system = SYSTEMS.find(([pattern]) => pattern.test(agent))?.[1];
  if (browser) return system ? `${browser} on ${system}` : browser;
  // Browsers all begin "Mozilla/5.0", which says nothing of which one it is.
  if (/^Mozilla\//.test(agent)) return system ? `A browser on ${system}` : "Unknown browser";
  // Not a browser (a script, a tool): its first product token, as it calls itself.
  return agent.split(/\s/)[0].slice(0, LIMIT);
}
