import { HyperFormula } from 'hyperformula';
it('runs', () => { expect(HyperFormula.version).toBeTruthy(); });
