// @ts-check
// The invented demo atelier's sign-ins, printed by npm start and used by the seed and the tests.
export const DEMO_SIGN_INS = {
	password: 'quarterline-demo',
	accounts: [
		{ role: 'owner', email: 'margit@ondine.example', name: 'Margit Solberg' },
		{ role: 'cutter', email: 'tomasz@ondine.example', name: 'Tomasz Weller' },
		{ role: 'cutter', email: 'ines@ondine.example', name: 'Ines Carvalho' },
		{ role: 'shopper', email: 'priya@example.com', name: 'Priya Anand' },
		{ role: 'shopper', email: 'lotte@example.com', name: 'Lotte Brandt' }
	]
};
