/**
 * Errors shared by the page's worker clients (src/client) and whoever awaits them (the stores): kept
 * beside the messages so the store can tell a cancelled request from a failed one without importing
 * client code.
 */

/** Why a request's promise was rejected without an error of its own; callers normally ignore it. */
export class GridRequestCancelled extends Error {
  constructor(
    readonly requestId: string,
    readonly reason: 'superseded' | 'cancelled' | 'disposed',
  ) {
    super(`grid request ${requestId} was ${reason}`);
    this.name = 'GridRequestCancelled';
  }
}
