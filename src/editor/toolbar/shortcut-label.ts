// How the modifier key of shortcuts is named in tooltips. "Ctrl" on the server and first render (so the
// markup matches), the same on every platform but Apple's.
export const SHORTCUT_MOD = "Ctrl/⌘";
