import "server-only";
import { DomainError } from "@/lib/contracts/errors";
import { StorageError } from "@/lib/storage/object-store";

/**
 * Object-storage faults become a 503 the client can show; the raw SDK message is only logged.
 * `what` finishes the sentence "The file store is unavailable; …" (what did or did not happen).
 */
export async function withStorage<T>(what: string, run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (!(error instanceof StorageError)) throw error;
    console.error(`[api] ${what}:`, error.message);
    throw new DomainError("storage_unavailable", `The file store is unavailable; ${what}. Try again shortly.`, { retryAfterS: 5 });
  }
}
