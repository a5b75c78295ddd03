import { LANG_VERSION } from "@cribra/lang"; console.log(LANG_VERSION);
