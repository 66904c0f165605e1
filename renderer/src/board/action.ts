/**
 * Svelte action that attaches the framework-free board controller to an element and hands it back to the owner.
 */
import type { Action } from 'svelte/action';
import { BoardController, type BoardCallbacks, type BoardOptions } from './BoardController.ts';

export interface BoardActionParams {
  callbacks: BoardCallbacks;
  options: BoardOptions;
  /** Receives the controller once it exists, and null when it is destroyed. */
  onReady(c: BoardController | null): void;
}

export const board: Action<HTMLElement, BoardActionParams> = (node, params) => {
  const ctl = new BoardController(node, params.callbacks, params.options);
  params.onReady(ctl);
  return {
    update(next: BoardActionParams) {
      ctl.setCallbacks(next.callbacks);
      ctl.setOptions(next.options);
    },
    destroy() {
      params.onReady(null);
      ctl.destroy();
    },
  };
};
