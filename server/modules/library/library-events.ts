import type { EntityManager } from '@mikro-orm/core';
import type { ReviewDecision } from '@/lib/schemas/library';

/**
 * Review events the library announces after a change has committed, so that other modules (the
 * review e-mails) can react without the library knowing them. One listener per ORM (keyed by its
 * driver), so two apps over two databases in one process never hear each other's events.
 */
export type LibraryEvent =
  | { type: 'in-review'; complexId: string; groupId: string; formula: string; name: string; actorId: string }
  | {
      type: 'reviewed';
      complexId: string;
      groupId: string;
      formula: string;
      name: string;
      actorId: string;
      decision: ReviewDecision;
      comment: string;
      submitterId: string | null;
    };

type Listener = (event: LibraryEvent) => void;
const listeners = new WeakMap<object, Listener>();

export function onLibraryEvents(em: EntityManager, listener: Listener): void {
  listeners.set(em.getDriver(), listener);
}

/** Never throws: a listener's failure must not undo or fail the change that was made. */
export function emitLibraryEvent(em: EntityManager, event: LibraryEvent): void {
  try {
    listeners.get(em.getDriver())?.(event);
  } catch (error) {
    console.error('[library-events] listener failed:', error);
  }
}
