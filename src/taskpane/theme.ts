/**
 * Light or dark: the host's theme where Office reports one (the add-in's entry
 * reads it), otherwise the system's preference, followed as it changes. The
 * stylesheet holds both palettes; the pane only names which applies, on the
 * root element (`data-theme`), and where it came from (`data-theme-source`).
 */

export type PaneTheme = "light" | "dark";

export function applyTheme(doc: Document, host: PaneTheme | null): void {
  const root = doc.documentElement;
  if (host !== null) {
    root.dataset.theme = host;
    root.dataset.themeSource = "host";
    return;
  }
  root.dataset.themeSource = "system";
  const query = doc.defaultView?.matchMedia("(prefers-color-scheme: dark)") ?? null;
  const follow = () => {
    root.dataset.theme = query?.matches ? "dark" : "light";
  };
  follow();
  query?.addEventListener("change", follow);
}
