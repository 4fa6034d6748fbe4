// The clearance and notes panels in one download (LazyCarePanels): the form-keeping hook they share then
// travels with them, not in the code every page loads.
export { ClearancePanel } from './clearance-panel';
export { NotesPanel } from './notes-panel';
