/**
 * Invented interval rows with each unit's inspection times (the inspection-times column, separated by
 * ;): left rows before the first inspection, interval rows between two consecutive ones, suspensions
 * at the last; every row consistent with its schedule. Used by the CLI and API tests of stated schedules.
 */
export const STATED_CSV = [
  'start,end,seen',
  ',20,20; 55; 90; 125',
  '45,70,15; 45; 70; 100',
  '90,,30; 60; 90',
  '55,90,20; 55; 90; 120',
  '60,95,30; 60; 95',
  '30,60,30; 60; 90',
  ',40,40; 80; 120',
  '80,120,40; 80; 120',
  '100,,15; 45; 70; 100',
  '70,100,35; 70; 100',
].join('\n');
