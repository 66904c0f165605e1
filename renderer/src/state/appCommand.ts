/**
 * The app's commands: one list read by the menus, the keyboard and the command finder, so every command is
 * reachable by search and each shortcut is declared once.
 */
export interface AppCommand {
  id: string;
  label: string;
  /** Group shown in the finder ("File", "Edit", "View", "Draw", "Board"). */
  group: string;
  /** Shortcuts in lib/keys.ts notation; the first one is shown. */
  keys?: string[];
  /** False greys the command out (nothing selected, nothing to undo). */
  enabled?: () => boolean;
  run: () => void | Promise<void>;
}
