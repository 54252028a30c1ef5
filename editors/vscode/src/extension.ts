// VS Code client for the kiln language server (`kiln serve`, stdio).
import * as vscode from 'vscode';
import {
  DidChangeConfigurationNotification,
  LanguageClient,
  LanguageClientOptions,
  ServerOptions,
  TransportKind,
} from 'vscode-languageclient/node';
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

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  const output = vscode.window.createOutputChannel('kiln');
  const kiln = new KilnClient(output);
  active = kiln;
  context.subscriptions.push(
    output,
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
