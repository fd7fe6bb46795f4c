/**
 * The sample projects shipped with the app (sample-projects/ in the repository): each project file
 * and its CSV are bundled as build assets, so the app can open one without any file access. They
 * are invented plants; their READMEs tell the story.
 */
import heatingHistorianCsv from '../../../../sample-projects/heating-historian/heating-historian.csv?url';
import heatingHistorianProject from '../../../../sample-projects/heating-historian/heating-historian.spcritic?raw';
import heatingLoopCsv from '../../../../sample-projects/heating-loop/heating-loop.csv?url';
import heatingLoopProject from '../../../../sample-projects/heating-loop/heating-loop.spcritic?raw';
import tankCsv from '../../../../sample-projects/tank-levels/tank-levels.csv?url';
import tankProject from '../../../../sample-projects/tank-levels/tank-levels.spcritic?raw';

export interface SampleProject {
  id: string;
  title: string;
  summary: string;
  projectText: string;
  projectFile: string;
  csvUrl: string;
  csvFile: string;
}

export const SAMPLE_PROJECTS: readonly SampleProject[] = [
  {
    id: 'tank-levels', title: 'Two tank levels', summary: 'two coupled tanks, an inlet valve, and a quadratic cost on the level errors; a linear plant whose answer is known exactly.',
    projectText: tankProject, projectFile: 'tank-levels.spcritic', csvUrl: tankCsv, csvFile: 'tank-levels.csv',
  },
  {
    id: 'heating-loop', title: 'Heating loop', summary: 'a zone heated through a valve that saturates at 0 and 100 %; nonlinear, with actuator limits.',
    projectText: heatingLoopProject, projectFile: 'heating-loop.spcritic', csvUrl: heatingLoopCsv, csvFile: 'heating-loop.csv',
  },
  {
    id: 'heating-historian', title: 'Heating loop, historian export', summary: 'the same plant as a building historian exports it: semicolons, decimal commas, gaps and bad rows.',
    projectText: heatingHistorianProject, projectFile: 'heating-historian.spcritic', csvUrl: heatingHistorianCsv, csvFile: 'heating-historian.csv',
  },
];
