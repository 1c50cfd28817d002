import { describe, expect, it } from 'vitest';
import { emptyGrid, fillCells, gridFromBlock, gridPoints, pointKey, removeRow, setCell, setExclusion, setReplicateCount } from '@/features/assays/lib/point-grid';

const nouns = { x: '[S]', y: 'v₀' };

describe('gridPoints', () => {
  it('lists the points row by row, replicates within a row, with their exclusions', () => {
    let grid = gridFromBlock({ rows: [{ x: 0.1, y: [1, 2] }, { x: 0.2, y: [3, null] }], replicateCount: 2, notes: [], problems: [] });
    const second = pointKey(grid.rows[0].id, 2);
    grid = setExclusion(grid, second, 'bubble in the well');
    const { points, problems } = gridPoints(grid, nouns);
    expect(problems).toEqual([]);
    expect(points.map((point) => [point.x, point.y, point.replicate, point.excluded, point.reason])).toEqual([
      [0.1, 1, 1, false, null],
      [0.1, 2, 2, true, 'bubble in the well'],
      [0.2, 3, 1, false, null],
    ]);
  });

  it('names cells that cannot be used and leaves their points out', () => {
    let grid = emptyGrid(3, 1);
    grid = setCell(grid, grid.rows[0].id, 'x', '0.1');
    grid = setCell(grid, grid.rows[0].id, 0, 'fast');
    grid = setCell(grid, grid.rows[1].id, 0, '4');
    grid = setCell(grid, grid.rows[2].id, 'x', '-1');
    grid = setCell(grid, grid.rows[2].id, 0, '2');
    const { points, problems } = gridPoints(grid, nouns);
    expect(points).toEqual([]);
    expect(problems.map((problem) => problem.message)).toEqual([
      'Row 1, replicate 1: “fast” is not a number.',
      'Row 2: enter [S] for these rates.',
      'Row 3: [S] must be at least 0.',
    ]);
  });

  it('refuses x above a maximum (pH 14) and negative rates', () => {
    const grid = gridFromBlock({ rows: [{ x: 15, y: [1] }, { x: 7, y: [-2] }], replicateCount: 1, notes: [], problems: [] });
    expect(gridPoints(grid, { x: 'pH', y: 'the rate', xMax: 14 }).problems.map((problem) => problem.message)).toEqual([
      'Row 1: pH must be at most 14.',
      'Row 2, replicate 1: the rate must be at least 0; leave out a rate that came out negative.',
    ]);
  });
});

describe('editing the grid', () => {
  it('adds an empty row when the last row is typed into', () => {
    const grid = emptyGrid(1, 1);
    expect(setCell(grid, grid.rows[0].id, 'x', '1').rows).toHaveLength(2);
  });

  it('fills a pasted block from a cell on, adding rows and replicate columns', () => {
    const grid = fillCells(emptyGrid(2, 1), 1, 1, [
      ['5', '6'],
      ['7', '8'],
    ]);
    expect(grid.replicates).toBe(2);
    expect(grid.rows.slice(1, 3).map((row) => row.y)).toEqual([
      ['5', '6'],
      ['7', '8'],
    ]);
  });

  it('drops the exclusions of removed replicate columns and rows', () => {
    let grid = gridFromBlock({ rows: [{ x: 1, y: [1, 2] }], replicateCount: 2, notes: [], problems: [] });
    grid = setExclusion(grid, pointKey(grid.rows[0].id, 2), 'outlier');
    expect(setReplicateCount(grid, 1).exclusions).toEqual({});
    grid = setExclusion(grid, pointKey(grid.rows[0].id, 1), 'outlier');
    expect(removeRow(grid, grid.rows[0].id).exclusions).toEqual({});
  });
});
