// Prints the demo sign-ins of the seeded scenario, one per role (`npm start` calls this).
import { ROLE_LABELS } from '@cc/shared';
import { DEMO_PASSWORD, PEOPLE } from '../seeds/data/demo-scenario';

console.log(`Demo sign-ins (password for all: ${DEMO_PASSWORD}):`);
for (const person of PEOPLE) {
  console.log(`  ${ROLE_LABELS[person.role].padEnd(24)} ${person.email.padEnd(34)} ${person.name}`);
}
