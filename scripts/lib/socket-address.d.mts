import type { IncomingMessage } from "node:http";

export declare const SOCKET_ADDRESS_HEADER: "x-kb-socket-address";
export declare function stampSocketAddress(req: IncomingMessage): void;
