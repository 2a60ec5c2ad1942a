// The invented demo atelier's catalogue: Atelier Ondine, its styles and the cloth on its shelves.
// Care texts are written in words of our own (the registered care symbols are not drawn).

export const DEMO_STYLES = [
	{
		slug: 'rue-straight',
		name: 'Rue straight skirt',
		kind: 'straight',
		description: 'Straight from hip to hem with darts front and back, a zip at centre back and a narrow waistband. Below the knee it gets a back vent so you can walk.',
		makingPrice: 8900,
		leadDays: 7,
		sortOrder: 1
	},
	{
		slug: 'quill-pencil',
		name: 'Quill pencil skirt',
		kind: 'pencil',
		description: 'Narrows gently from the hip to the hem for a close line, always with a back vent.',
		makingPrice: 9500,
		leadDays: 8,
		sortOrder: 2
	},
	{
		slug: 'meadow-a-line',
		name: 'Meadow A-line skirt',
		kind: 'a-line',
		description: 'The front darts are closed and turned into flare at the hem: smooth at the waist, easy to move in.',
		makingPrice: 9200,
		leadDays: 7,
		sortOrder: 3
	},
	{
		slug: 'swing-half-circle',
		name: 'Swing half-circle skirt',
		kind: 'half-circle',
		description: 'A half circle of cloth that falls in soft folds, with no darts at all.',
		makingPrice: 9900,
		leadDays: 9,
		sortOrder: 4
	},
	{
		slug: 'carousel-full-circle',
		name: 'Carousel full-circle skirt',
		kind: 'full-circle',
		description: 'A full circle that spins out when you turn. It takes the most cloth of all our styles.',
		makingPrice: 11_900,
		leadDays: 10,
		sortOrder: 5
	},
	{
		slug: 'promenade-six-gore',
		name: 'Promenade six-gore skirt',
		kind: 'gored',
		description: 'Six shaped panels, fitted through the hip and flaring below it, with the shaping in the seams.',
		makingPrice: 12_900,
		leadDays: 12,
		sortOrder: 6
	}
] as const;

export const DEMO_OPTION_PRICES = { lining: 1800, pockets: 1200, band: 0, facing: 0, 'invisible-zip': 400 };

export const DEMO_FABRICS = [
	{
		slug: 'harbour-wool-twill',
		name: 'Harbour wool twill',
		colour: 'Navy',
		swatchHex: '#26344f',
		fibreContent: '100 % wool',
		careText: 'Dry clean, or hand wash cold and dry flat. Press with a cloth on a warm iron.',
		widthCm: 150,
		pricePerMetre: 3800,
		stockCm: 1200,
		nap: false,
		stretch: false,
		shrinkagePct: 3
	},
	{
		slug: 'oat-linen-canvas',
		name: 'Linen canvas',
		colour: 'Oat',
		swatchHex: '#cdbb9a',
		fibreContent: '100 % linen',
		careText: 'Machine wash at 40 °C, line dry, iron hot while still damp. Linen softens with every wash.',
		widthCm: 140,
		pricePerMetre: 2400,
		stockCm: 800,
		nap: false,
		stretch: false,
		shrinkagePct: 6,
		// Linen shrinks more along the warp than across (invented figures for the demo cloth).
		shrinkageAcrossPct: 3
	},
	{
		slug: 'rust-needlecord',
		name: 'Cotton needlecord',
		colour: 'Rust',
		swatchHex: '#9c4a2c',
		fibreContent: '98 % cotton, 2 % elastane',
		careText: 'Machine wash at 30 °C inside out, do not tumble dry, press from the wrong side over a towel.',
		widthCm: 140,
		pricePerMetre: 2200,
		stockCm: 150,
		nap: true,
		stretch: false,
		shrinkagePct: 4
	},
	{
		slug: 'ink-viscose-crepe',
		name: 'Viscose crepe',
		colour: 'Ink blue',
		swatchHex: '#2b3a67',
		fibreContent: '100 % viscose',
		careText: 'Hand wash cold or gentle machine wash at 30 °C, do not wring, dry flat, cool iron.',
		widthCm: 145,
		pricePerMetre: 1900,
		stockCm: 600,
		nap: false,
		stretch: false,
		shrinkagePct: 7
	},
	{
		slug: 'chalk-cotton-poplin',
		name: 'Cotton poplin',
		colour: 'Chalk white',
		swatchHex: '#f1eee6',
		fibreContent: '100 % cotton',
		careText: 'Machine wash at 40 °C, line dry, iron hot.',
		widthCm: 112,
		pricePerMetre: 1400,
		stockCm: 1500,
		nap: false,
		stretch: false,
		shrinkagePct: 4
	},
	{
		slug: 'plum-silk-wool-crepe',
		name: 'Silk and wool crepe',
		colour: 'Plum',
		swatchHex: '#5b2b4a',
		fibreContent: '70 % wool, 30 % silk',
		careText: 'Dry clean only. Steam rather than press.',
		widthCm: 114,
		pricePerMetre: 5600,
		stockCm: 90,
		nap: false,
		stretch: false,
		shrinkagePct: 2
	},
	{
		slug: 'black-ponte',
		name: 'Stretch ponte',
		colour: 'Black',
		swatchHex: '#1c1c1f',
		fibreContent: '68 % viscose, 27 % polyamide, 5 % elastane',
		careText: 'Machine wash at 30 °C, dry flat, cool iron if needed.',
		widthCm: 150,
		pricePerMetre: 2100,
		stockCm: 700,
		nap: false,
		stretch: true,
		shrinkagePct: 2
	}
] as const;
