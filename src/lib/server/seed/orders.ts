// Invented demo orders, at least one in every stage, each drafted by the real engine so the
// workroom's figures and tickets are the ones the product would have computed.
import { MAIN_PATH, type OrderStage } from '$lib/orders/stages';

export type DemoOrder = {
	number: string;
	shopper: string; // a demo account's e-mail, or a guest's
	name: string;
	stage: OrderStage;
	/** days before the seed ran */
	placedDaysAgo: number;
	style: string;
	fabric: string;
	measurements: { waist: number; hip: number; length: number; waistToHip: number | null };
	options: { lining?: boolean; pockets?: boolean; waistband?: 'band' | 'facing' };
	city: string;
	country: string;
	postcode: string;
	line1: string;
	tracking?: string;
};

export const DEMO_ORDERS: DemoOrder[] = [
	{ number: 'QL-1001', shopper: 'priya@example.com', name: 'Priya Anand', stage: 'delivered', placedDaysAgo: 41, style: 'rue-straight', fabric: 'harbour-wool-twill', measurements: { waist: 72, hip: 98, length: 60, waistToHip: 20.5 }, options: { lining: true }, line1: '14 Quayside Row', city: 'Galway', postcode: 'H91 X2C4', country: 'IE', tracking: 'PK204871IE' },
	{ number: 'QL-1002', shopper: 'amara.okafor@example.net', name: 'Amara Okafor', stage: 'delivered', placedDaysAgo: 35, style: 'meadow-a-line', fabric: 'oat-linen-canvas', measurements: { waist: 81, hip: 106, length: 65, waistToHip: 21 }, options: { pockets: true }, line1: 'Lindenstraße 8', city: 'Bremen', postcode: '28195', country: 'DE', tracking: 'PK204990DE' },
	{ number: 'QL-1003', shopper: 'lotte@example.com', name: 'Lotte Brandt', stage: 'shipped', placedDaysAgo: 16, style: 'swing-half-circle', fabric: 'ink-viscose-crepe', measurements: { waist: 66, hip: 92, length: 58, waistToHip: 19 }, options: {}, line1: 'Keizersgracht 301', city: 'Amsterdam', postcode: '1016 ED', country: 'NL', tracking: 'PK205312NL' },
	{ number: 'QL-1004', shopper: 'chloe.marchand@example.org', name: 'Chloé Marchand', stage: 'finished', placedDaysAgo: 12, style: 'quill-pencil', fabric: 'black-ponte', measurements: { waist: 70, hip: 96, length: 62, waistToHip: 20 }, options: { waistband: 'facing' }, line1: '7 rue des Tanneurs', city: 'Lyon', postcode: '69002', country: 'FR' },
	{ number: 'QL-1005', shopper: 'priya@example.com', name: 'Priya Anand', stage: 'sewn', placedDaysAgo: 10, style: 'promenade-six-gore', fabric: 'chalk-cotton-poplin', measurements: { waist: 72, hip: 98, length: 70, waistToHip: 20.5 }, options: { lining: true, pockets: true }, line1: '14 Quayside Row', city: 'Galway', postcode: 'H91 X2C4', country: 'IE' },
	{ number: 'QL-1006', shopper: 'sunniva.dahl@example.com', name: 'Sunniva Dahl', stage: 'cutting', placedDaysAgo: 8, style: 'rue-straight', fabric: 'rust-needlecord', measurements: { waist: 100, hip: 128, length: 64, waistToHip: 22 }, options: { pockets: true }, line1: 'Bryggen 3', city: 'Bergen', postcode: '5003', country: 'NO' },
	{ number: 'QL-1007', shopper: 'keiko.mori@example.com', name: 'Keiko Mori', stage: 'cutting', placedDaysAgo: 7, style: 'carousel-full-circle', fabric: 'ink-viscose-crepe', measurements: { waist: 64, hip: 88, length: 55, waistToHip: 18 }, options: {}, line1: 'Via dei Calzaiuoli 12', city: 'Florence', postcode: '50122', country: 'IT' },
	{ number: 'QL-1008', shopper: 'beatriz.lima@example.com', name: 'Beatriz Lima', stage: 'paid', placedDaysAgo: 5, style: 'rue-straight', fabric: 'harbour-wool-twill', measurements: { waist: 88, hip: 112, length: 72, waistToHip: 21.5 }, options: { lining: true }, line1: 'Rua das Flores 45', city: 'Porto', postcode: '4050-265', country: 'PT' },
	{ number: 'QL-1009', shopper: 'lotte@example.com', name: 'Lotte Brandt', stage: 'paid', placedDaysAgo: 3, style: 'meadow-a-line', fabric: 'plum-silk-wool-crepe', measurements: { waist: 66, hip: 92, length: 60, waistToHip: 19 }, options: { lining: true }, line1: 'Keizersgracht 301', city: 'Amsterdam', postcode: '1016 ED', country: 'NL' },
	{ number: 'QL-1010', shopper: 'hanne.ruud@example.com', name: 'Hanne Ruud', stage: 'paid', placedDaysAgo: 1, style: 'quill-pencil', fabric: 'harbour-wool-twill', measurements: { waist: 76, hip: 101, length: 66, waistToHip: null }, options: {}, line1: 'Storgata 19', city: 'Tromsø', postcode: '9008', country: 'NO' },
	{ number: 'QL-1011', shopper: 'rosa.ferreira@example.com', name: 'Rosa Ferreira', stage: 'awaiting_payment', placedDaysAgo: 0, style: 'swing-half-circle', fabric: 'oat-linen-canvas', measurements: { waist: 74, hip: 99, length: 57, waistToHip: 20 }, options: { pockets: true }, line1: 'Calle Mayor 21', city: 'Madrid', postcode: '28013', country: 'ES' },
	{ number: 'QL-1012', shopper: 'ines.d@example.com', name: 'Inès Dubois', stage: 'cancelled', placedDaysAgo: 20, style: 'rue-straight', fabric: 'chalk-cotton-poplin', measurements: { waist: 69, hip: 95, length: 60, waistToHip: 20 }, options: {}, line1: '3 place du Marché', city: 'Nantes', postcode: '44000', country: 'FR' },
	{ number: 'QL-1013', shopper: 'priya@example.com', name: 'Priya Anand', stage: 'refunded', placedDaysAgo: 25, style: 'carousel-full-circle', fabric: 'oat-linen-canvas', measurements: { waist: 72, hip: 98, length: 62, waistToHip: 20.5 }, options: {}, line1: '14 Quayside Row', city: 'Galway', postcode: 'H91 X2C4', country: 'IE' }
];

/** The stages an order passed through to reach `stage`, in order. */
export function pathTo(stage: OrderStage): OrderStage[] {
	const main = MAIN_PATH;
	if (stage === 'cancelled') return ['awaiting_payment', 'paid', 'cancelled'];
	if (stage === 'refunded') return ['awaiting_payment', 'paid', 'refunded'];
	return main.slice(0, main.indexOf(stage) + 1);
}
