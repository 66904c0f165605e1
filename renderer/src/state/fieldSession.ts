/**
 * Context key for the editor's field sessions: a quantity field tells the editor when typing starts and ends, so
 * the keystrokes of one entry become one undo step (and Esc can drop them). The App provides it.
 */
export const FIELD_SESSION = Symbol('stripwright.field-session');

export interface FieldSession {
  start(): void;
  /** commit false: drop the edits made since start. */
  end(commit: boolean): void;
}
