#!/usr/bin/env node
// Run by npm (`prepare` of this workspace) before it links the `cribra` bin: npm links and marks
// executable only a bin file that exists, so a fresh checkout gets a placeholder until `tsc -b`
// overwrites it (overwriting keeps the executable mode).
const { chmodSync, existsSync, mkdirSync, writeFileSync } = require('node:fs');
const { join } = require('node:path');

const bin = join(__dirname, '..', 'dist', 'main.js');
if (!existsSync(bin)) {
  mkdirSync(join(__dirname, '..', 'dist'), { recursive: true });
  writeFileSync(
    bin,
    '#!/usr/bin/env node\nprocess.stderr.write("cribra is not built yet: run npx tsc -b at the repository root\\n");\nprocess.exitCode = 2;\n',
  );
}
chmodSync(bin, 0o755);
