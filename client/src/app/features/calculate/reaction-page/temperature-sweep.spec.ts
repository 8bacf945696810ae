import { coveredRun, sweepTemperatures } from './temperature-sweep';

describe('temperature sweep for the ΔrH(T) curve', () => {
  it('asks for a sorted grid that holds 298.15 K and the requested temperature once each', () => {
    const grid = sweepTemperatures(812.5);
    expect(grid).toEqual([...grid].sort((a, b) => a - b));
    expect(grid.filter((t) => t === 298.15)).toHaveLength(1);
    expect(grid).toContain(812.5);
    expect(new Set(grid).size).toBe(grid.length);
    expect(grid[0]).toBe(100);
    expect(grid[grid.length - 1]).toBe(6000);
    expect(sweepTemperatures(300).filter((t) => t === 300)).toHaveLength(1);
  });

  it('keeps the unbroken run of answered points around the requested temperature', () => {
    const points = [
      { temperatureK: 100, deltaH: 1 },
      { temperatureK: 200, deltaH: null },
      { temperatureK: 298.15, deltaH: 3 },
      { temperatureK: 400, deltaH: 4 },
      { temperatureK: 500, deltaH: 5 },
      { temperatureK: 600, deltaH: null },
      { temperatureK: 700, deltaH: 7 },
    ];
    expect(coveredRun(points, 400).map((p) => p.temperatureK)).toEqual([298.15, 400, 500]);
  });

  it('draws nothing when the requested temperature itself was refused', () => {
    expect(coveredRun([{ temperatureK: 298.15, deltaH: null }], 298.15)).toEqual([]);
  });
});
