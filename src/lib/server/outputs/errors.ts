// Why a full-scale file cannot be made, with the HTTP status its route answers: a bad paper or width
// is the asker's mistake (400), a missing order, draft or retired style is not there to print (404), and
// stored measurements that no longer draft are the order's problem (422). Never a 500, never an empty file.
// One class for every output (the job runner and the routes read the same): see problem.ts.
export { OutputProblem as OutputError } from './problem';
