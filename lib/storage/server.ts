import "server-only";
import { serverSettings } from "@/lib/settings/server";
import { createObjectStore, type ObjectStore } from "./object-store";

// One client per server process, cached like the database pool so the dev server's reloads do not
// pile up sockets.
const globalForStorage = globalThis as unknown as { gyroluxObjectStore?: ObjectStore };

export const objectStore: ObjectStore = globalForStorage.gyroluxObjectStore ?? createObjectStore(serverSettings.storage);
globalForStorage.gyroluxObjectStore = objectStore;
