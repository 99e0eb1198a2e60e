import { createRouteHandler } from "uploadthing/next";
import { fileRouter } from "./core";

/** The upload service's endpoint; token and service URLs come from UPLOADTHING_* variables. */
export const { GET, POST } = createRouteHandler({ router: fileRouter, config: { logLevel: "Error" } });
