import { ENGINE_VERSION } from "@cribra/engine"; export const LANG_VERSION = "0.1.0"; export const BUILT_WITH = ENGINE_VERSION;
