/**
 * The language server entry. The connection picks its transport from the
 * command line: `--stdio` for any editor, `--node-ipc` when the VS Code
 * client starts the bundled server.
 */
import './node-shim.js';
import { startLanguageServer } from 'langium/lsp';
import { NodeFileSystem } from 'langium/node';
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { createVacnetServices } from './vacnet-module.js';

const connection = createConnection(ProposedFeatures.all);
const { shared } = createVacnetServices({ connection, ...NodeFileSystem });
startLanguageServer(shared);
