// Registers a module loader hook (node:module register, Node ≥ 20.6) that appends the URL of every module loaded
// to the file named by FLOORCAST_MODULE_LIST, so a test can see what importing a subpath loads.
import { register } from "node:module";

register("./list-modules-hooks.mjs", import.meta.url);
