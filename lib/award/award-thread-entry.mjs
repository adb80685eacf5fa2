// Worker threads do not inherit tsx's loader: register it, then run the
// TypeScript thread body.
import { register } from "tsx/esm/api";

register();
await import("./award-thread.ts");
