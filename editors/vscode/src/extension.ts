// VS Code client for the kiln language server (`kiln serve`, stdio).
import * as vscode from 'vscode';
import {
  DidChangeConfigurationNotification,
  ExecuteCommandRequest,
  LanguageClient,
  LanguageClientOptions,
  ServerOptions,
  TransportKind,
} from 'vscode-languageclient/node';
import {
  EquilibriumAnswer,
  defaultMix,
  equilibriumArgs,
  formatEquilibrium,
  serverCommand as equilibriumCommand,
  showCommand as showEquilibriumCommand,
} from './equilibrium';
import { reindentAfterKeyword } from './indent';
import { restartKeys, serverCommand, toServerSettings } from './settings';

const clientId = 'kiln';
const clientName = 'kiln language server';

function readConfig(): (key: string) => unknown {
  const cfg = vscode.workspace.getConfiguration('kiln');
  return (key: string) => cfg.get(key);
}

/** Owns the running client; there is one per extension activation. */
class KilnClient {
  private client: LanguageClient | undefined;

  constructor(private readonly output: vscode.OutputChannel) {}

  async start(): Promise<void> {
    const get = readConfig();
    const { command, args } = serverCommand(get);
    const serverOptions: ServerOptions = {
      run: { command, args, transport: TransportKind.stdio },
      debug: { command, args, transport: TransportKind.stdio },
    };
    const clientOptions: LanguageClientOptions = {
      documentSelector: [
        { scheme: 'file', language: 'kiln' },
        { scheme: 'untitled', language: 'kiln' },
      ],
      initializationOptions: { kiln: toServerSettings(get) },
      outputChannel: this.output,
      middleware: {
        workspace: {
          // Answer workspace/configuration pulls for the "kiln" section with
          // the server's key names instead of the nested VS Code layout.
          configuration: (params, token, next) => {
            const settings = toServerSettings(readConfig());
            const fallback = next(params, token);
            return Promise.resolve(fallback).then((values) => {
              if (!Array.isArray(values)) {
                return values;
              }
              return params.items.map((item, i) =>
                item.section === 'kiln' ? settings : values[i],
              );
            });
          },
        },
      },
    };
    const client = new LanguageClient(clientId, clientName, serverOptions, clientOptions);
    this.client = client;
    try {
      await client.start();
    } catch (err) {
      const msg = err instanceof Error ? err.message : String(err);
      void vscode.window
        .showErrorMessage(
          `kiln: could not start "${command} ${args.join(' ')}": ${msg}. Set "kiln.server.path" to the kiln binary.`,
          'Open Settings',
        )
        .then((choice) => {
          if (choice === 'Open Settings') {
            void vscode.commands.executeCommand('workbench.action.openSettings', 'kiln.server');
          }
        });
    }
  }

  /** The running client, or undefined. */
  running(): LanguageClient | undefined {
    const client = this.client;
    return client && client.isRunning() ? client : undefined;
  }

  async stop(): Promise<void> {
    const client = this.client;
    this.client = undefined;
    if (client && client.isRunning()) {
      await client.stop();
    }
  }

  async restart(): Promise<void> {
    await this.stop();
    await this.start();
  }

  /** Sends the current settings as workspace/didChangeConfiguration {"kiln": {...}}. */
  async pushSettings(): Promise<void> {
    const client = this.client;
    if (!client || !client.isRunning()) {
      return;
    }
    await client.sendNotification(DidChangeConfigurationNotification.type, {
      settings: { kiln: toServerSettings(readConfig()) },
    });
  }
}

let active: KilnClient | undefined;

/**
 * Re-indents a line when a blank ends its first word and that word is a
 * keyword: a statement typed under an indented line goes back to column 0
 * (the language configuration's rules can only add or remove one level).
 * Runs with editor.formatOnType, on by default for kiln files.
 */
const keywordIndenter: vscode.OnTypeFormattingEditProvider = {
  provideOnTypeFormattingEdits(document, position) {
    const lines: string[] = [];
    for (let i = 0; i <= position.line; i++) {
      lines.push(document.lineAt(i).text);
    }
    const edit = reindentAfterKeyword(lines, position.line);
    if (!edit) {
      return [];
    }
    const range = new vscode.Range(position.line, 0, position.line, edit.length);
    return [vscode.TextEdit.replace(range, edit.text)];
  },
};

/**
 * The command behind "kiln: Equilibrium / flame temperature…" and the code
 * lens: asks for the mixture, runs the server's kiln.equilibrium on the
 * kiln document (the lens's, else the active editor's) and shows the
 * answer — the text `kiln equilibrium` prints — in the "kiln equilibrium"
 * output channel. Returns the answer (for tests and other extensions).
 */
async function showEquilibrium(
  kiln: KilnClient,
  results: vscode.OutputChannel,
  memory: { last?: string },
  arg?: { uri?: string; mix?: string },
): Promise<EquilibriumAnswer | undefined> {
  const uri = arg?.uri ?? vscode.window.activeTextEditor?.document.uri.toString();
  const doc = uri ? vscode.workspace.textDocuments.find((d) => d.uri.toString() === uri) : undefined;
  if (!uri || !doc || doc.languageId !== 'kiln') {
    void vscode.window.showErrorMessage('kiln: open a kiln file to compute an equilibrium over its species.');
    return undefined;
  }
  const client = kiln.running();
  if (!client) {
    void vscode.window.showErrorMessage('kiln: the language server is not running.');
    return undefined;
  }
  const get = readConfig();
  let mix = arg?.mix;
  if (mix === undefined) {
    mix = await vscode.window.showInputBox({
      title: 'kiln: equilibrium / flame temperature',
      prompt: 'Mixture as NAME:AMOUNT, … with the species names of the file',
      placeHolder: 'CH4:1, O2:2, N2:7.52',
      value: defaultMix(get, memory.last),
      ignoreFocusOut: true,
    });
  }
  if (mix === undefined || mix.trim() === '') {
    return undefined;
  }
  memory.last = mix;
  const args = equilibriumArgs(uri, mix, get);
  try {
    const answer = (await client.sendRequest(ExecuteCommandRequest.type, {
      command: equilibriumCommand,
      arguments: [args],
    })) as EquilibriumAnswer;
    results.clear();
    results.append(formatEquilibrium(mix, answer));
    results.show(true);
    return answer;
  } catch (err) {
    const msg = err instanceof Error ? err.message : String(err);
    void vscode.window.showErrorMessage(`kiln: ${msg}`);
    return undefined;
  }
}

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  const output = vscode.window.createOutputChannel('kiln');
  const results = vscode.window.createOutputChannel('kiln equilibrium');
  const kiln = new KilnClient(output);
  active = kiln;
  const memory: { last?: string } = {};
  context.subscriptions.push(
    output,
    results,
    vscode.commands.registerCommand(showEquilibriumCommand, (arg?: { uri?: string; mix?: string }) =>
      showEquilibrium(kiln, results, memory, arg),
    ),
    vscode.languages.registerOnTypeFormattingEditProvider({ language: 'kiln' }, keywordIndenter, ' '),
    vscode.commands.registerCommand('kiln.restartServer', async () => {
      await kiln.restart();
      void vscode.window.setStatusBarMessage('kiln: language server restarted', 3000);
    }),
    vscode.workspace.onDidChangeConfiguration(async (e) => {
      if (!e.affectsConfiguration('kiln')) {
        return;
      }
      if (restartKeys.some((k) => e.affectsConfiguration(k))) {
        await kiln.restart();
      } else {
        await kiln.pushSettings();
      }
    }),
  );
  await kiln.start();
}

export async function deactivate(): Promise<void> {
  const kiln = active;
  active = undefined;
  if (kiln) {
    await kiln.stop();
  }
}
