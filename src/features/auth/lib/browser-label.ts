/**
 * A session's browser in words ("Firefox on Linux") from its User-Agent header, for the session list. Only
 * the common families are named (the order matters: Edge and Opera also say Chrome, Chrome also says Safari);
 * anything else keeps a short form of the header.
 */
const BROWSERS: [RegExp, string][] = [
  [/\bEdg(e|A|iOS)?\//, 'Edge'],
  [/\bOPR\//, 'Opera'],
  [/\bFirefox\/|\bFxiOS\//, 'Firefox'],
  [/\bChromium\//, 'Chromium'],
  [/\bChrome\/|\bCriOS\//, 'Chrome'],
  [/\bVersion\/[\d.]+.*\bSafari\//, 'Safari'],
  [/^curl\//, 'curl'],
];
const SYSTEMS: [RegExp, string][] = [
  [/\bAndroid\b/, 'Android'],
  [/\b(iPhone|iPad|iPod)\b/, 'iOS'],
  [/\bWindows\b/, 'Windows'],
  [/\bMac OS X\b|\bMacintosh\b/, 'macOS'],
  [/\bCrOS\b/, 'ChromeOS'],
  [/\bLinux\b/, 'Linux'],
];

export function browserLabel(userAgent: string | null | undefined): string {
  const ua = userAgent?.trim() ?? '';
  if (!ua) return 'Unknown browser';
  const browser = BROWSERS.find(([re]) => re.test(ua))?.[1];
  const system = SYSTEMS.find(([re]) => re.test(ua))?.[1];
  if (browser && system) return `${browser} on ${system}`;
  if (browser) return browser;
  return ua.length > 48 ? `${ua.slice(0, 47)}…` : ua;
}
