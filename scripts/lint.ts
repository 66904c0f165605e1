// `npm run lint`: the dependency rule (scripts/dependency-rule.ts). Exits 1 listing every violation.
import { checkDependencyRule } from './dependency-rule.ts';
const violations = checkDependencyRule(new URL('..', import.meta.url).pathname);
for (const v of violations) console.error(`${v.file}:${v.line}: ${v.message}`);
console.log(violations.length === 0 ? 'lint: dependency rule holds' : `lint: ${violations.length} violation(s)`);
process.exit(violations.length === 0 ? 0 : 1);
