// How to take each measurement, in our own words.
export const MEASURE_STEPS = [
	{
		field: 'waist',
		label: 'Waist',
		how: 'Find your natural waist: bend to one side, and the crease that forms is where it is. Put the tape round there, level all the way round, snug but not tight: you should be able to slip a finger under it.'
	},
	{
		field: 'hip',
		label: 'Hip',
		how: 'Stand with your feet together and put the tape round the fullest part of your hips and seat. Look in a mirror to keep it level at the back.'
	},
	{
		field: 'waistToHip',
		label: 'Waist to hip',
		how: 'Down the side of your body, from your waist line to the level where you took your hip measurement. Tie a ribbon round your waist to mark it.'
	},
	{
		field: 'waistToKnee',
		label: 'Waist to knee',
		how: 'Down the side of your leg, from your waist line to the middle of your knee cap, standing straight. It tells us where a long fitted skirt needs its vent to open so you can walk. You may skip it.'
	},
	{
		field: 'length',
		label: 'Skirt length',
		how: 'Down the side, from your waist line to where you want the hem to fall. Wear the shoes you mean to wear with the skirt.'
	}
] as const;

// Starting points the shopper can pick and then adjust; lengths from the waist at the side.
export const LENGTH_PRESETS = [
	{ label: 'Above the knee (50 cm)', cm: 50 },
	{ label: 'Knee (60 cm)', cm: 60 },
	{ label: 'Midi (75 cm)', cm: 75 },
	{ label: 'Ankle (95 cm)', cm: 95 }
];

export const HEM_PRESETS = [
	{ label: 'Narrow, 2 cm (¾″)', cm: 2 },
	{ label: 'Standard, 4 cm (1½″)', cm: 4 },
	{ label: 'Deep, 6 cm (2⅜″)', cm: 6 }
];
