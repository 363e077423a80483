import { ProcessExecution, Task, TaskScope, tasks, window, workspace, type Disposable, type TaskProvider, type WorkspaceFolder } from 'vscode';
import { checkCommandLine, type CheckTaskDefinition } from './check-command-line.js';

/** The task type in tasks.json (contributes.taskDefinitions). */
export const CHECK_TASK_TYPE = 'vacnet';
/** The problem matcher contributed for `vacnet check` output. */
const PROBLEM_MATCHER = '$vacnet';

/**
 * `vacnet check` as a task: one per workspace folder on the whole folder,
 * and any the workspace defines in tasks.json. Findings reach the Problems
 * panel through the `$vacnet` problem matcher.
 */
export class CheckTaskProvider implements TaskProvider {
  constructor(private readonly cli: string) {}

  register(type: string): Disposable {
    return tasks.registerTaskProvider(type, this);
  }

  provideTasks(): Task[] {
    return (workspace.workspaceFolders ?? []).filter((folder) => folder.uri.scheme === 'file').map((folder) => this.task(folder, { type: 'vacnet', paths: ['.'] }));
  }

  resolveTask(task: Task): Task | undefined {
    const definition = task.definition as Partial<CheckTaskDefinition>;
    if (!Array.isArray(definition.paths)) return undefined;
    const folder = typeof task.scope === 'object' ? task.scope : workspace.workspaceFolders?.[0];
    if (!folder) return undefined;
    return this.task(folder, { type: 'vacnet', paths: definition.paths.filter((p): p is string => typeof p === 'string'), ...(Array.isArray(definition.args) ? { args: definition.args } : {}) }, task.name);
  }

  task(folder: WorkspaceFolder, definition: CheckTaskDefinition, name = 'check'): Task {
    const line = checkCommandLine(process.execPath, this.cli, definition);
    const execution = new ProcessExecution(line.command, line.args, { cwd: folder.uri.fsPath, env: line.env });
    const task = new Task(definition, folder ?? TaskScope.Workspace, name, 'vacnet', execution, PROBLEM_MATCHER);
    task.detail = `vacnet check ${definition.paths.join(' ')}`;
    return task;
  }
}

/** Runs `vacnet check` on a workspace folder (asking which one when there are several). */
export async function runWorkspaceCheck(cli: string): Promise<void> {
  const folders = (workspace.workspaceFolders ?? []).filter((folder) => folder.uri.scheme === 'file');
  if (folders.length === 0) {
    void window.showInformationMessage('Open a folder to check its .vacnet files.');
    return;
  }
  const folder = folders.length === 1 ? folders[0] : await window.showWorkspaceFolderPick({ placeHolder: 'Check the .vacnet files of which folder?' });
  if (!folder) return;
  await tasks.executeTask(new CheckTaskProvider(cli).task(folder, { type: 'vacnet', paths: ['.'] }));
}
