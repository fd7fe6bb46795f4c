/** What a new project lacks is said as what to do; consistency problems land on the field they name. */
import { describe, expect, it } from 'vitest';
import { newProjectDocument } from '../../../src/renderer/src/document/newProject';
import { consistencyPath, problemAt, problemsUnder, projectProblems } from '../../../src/renderer/src/document/projectProblems';

describe('project problems', () => {
  it('guides a new project to the data, the roles and a candidate', () => {
    const problems = projectProblems(newProjectDocument());
    expect(problemAt(problems, 'data.path')).toBe('choose a data file (CSV) first');
    expect(problemAt(problems, 'columns.states')).toContain('"state"');
    expect(problemAt(problems, 'candidates')).toBe('define at least one candidate policy');
  });

  it('turns the consistency checker’s places into field paths', () => {
    expect(consistencyPath('project, candidates[0] "Tuned (60, 90 %/m)".gain[1]')).toBe('candidates.0.gain.1');
    expect(consistencyPath('project, candidates[2].name')).toBe('candidates.2.name');
    expect(consistencyPath('project, columns.nextState.columns')).toBe('columns.nextState.columns');
  });

  it('finds the problems inside a field', () => {
    const problems = [{ path: 'candidates.0.std.0', message: 'x' }, { path: 'candidates.1.name', message: 'y' }];
    expect(problemsUnder(problems, 'candidates.0')).toHaveLength(1);
    expect(problemAt(problems, 'candidates.1.name')).toBe('y');
  });
});
