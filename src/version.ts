// The tool's name and version as reports state them (kept equal to package.json by a test).

export const TOOL = { name: 'headcheck', version: '0.1.0' } as const;
