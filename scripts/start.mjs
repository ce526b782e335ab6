// npm start: build the add-in, serve it over HTTPS on localhost with the Office
// development certificate, and load it into Excel where that can be done from
// here (Excel desktop on Windows or macOS). Everywhere else (Linux, Excel on the
// web) it still serves, and prints the exact steps to trust the certificate and
// upload manifest.xml. Options: --port N (default 3000), --no-sideload.
import { execFileSync } from "node:child_process";
import { copyFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { homedir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import webpack from "webpack";
import WebpackDevServer from "webpack-dev-server";
import makeConfig, { DEV_ORIGIN } from "../webpack.config.js";

const require = createRequire(import.meta.url);
const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const CERT_DIR = path.join(homedir(), ".office-addin-dev-certs");
const CERT_FILES = { ca: "ca.crt", cert: "localhost.crt", key: "localhost.key" };

function options(argv) {
  const out = { port: 3000, sideload: true };
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === "--no-sideload") out.sideload = false;
    else if (argv[i] === "--port" && /^\d+$/.test(argv[i + 1] ?? "")) out.port = Number(argv[++i]);
    else {
      console.error(`npm start: unknown option "${argv[i]}" (options: --port N, --no-sideload)`);
      process.exit(2);
    }
  }
  return out;
}

/** The development certificate: created and trusted by office-addin-dev-certs where it can, else read from its files. */
async function certificates() {
  let trustProblem = null;
  try {
    const devCerts = require("office-addin-dev-certs");
    const https = await devCerts.getHttpsServerOptions();
    return { https, trusted: true, trustProblem };
  } catch (e) {
    // Without sudo (a container, a root shell) the certificates are written but not trusted.
    trustProblem = e instanceof Error ? e.message.split("\n")[0] : String(e);
  }
  const paths = Object.fromEntries(Object.entries(CERT_FILES).map(([k, f]) => [k, path.join(CERT_DIR, f)]));
  const missing = Object.values(paths).filter((p) => !existsSync(p));
  if (missing.length > 0) {
    console.error(`npm start: no development certificate could be made (${trustProblem}); missing ${missing.join(", ")}`);
    process.exit(1);
  }
  const https = Object.fromEntries(Object.entries(paths).map(([k, p]) => [k, readFileSync(p)]));
  return { https, trusted: false, trustProblem };
}

/** The manifest to load: the repository's own for the default origin, a rewritten copy for another port. */
function manifestFor(origin) {
  const source = path.join(ROOT, "manifest.xml");
  if (origin === DEV_ORIGIN) return source;
  const dir = path.join(ROOT, "build", "dev");
  mkdirSync(dir, { recursive: true });
  const target = path.join(dir, "manifest.xml");
  writeFileSync(target, readFileSync(source, "utf8").replaceAll(DEV_ORIGIN, origin));
  return target;
}

function manifestId(manifest) {
  return /<Id>([^<]+)<\/Id>/.exec(readFileSync(manifest, "utf8"))?.[1] ?? "";
}

/** Excel desktop reads developer add-ins from a registry key (Windows) or a folder (macOS). */
function sideload(manifest) {
  if (process.platform === "win32") {
    const key = "HKCU\\Software\\Microsoft\\Office\\16.0\\WEF\\Developer";
    execFileSync("reg", ["add", key, "/v", manifestId(manifest), "/t", "REG_SZ", "/d", manifest, "/f"], { stdio: "pipe" });
    return [
      `Registered ${manifest} for Excel on this computer.`,
      "Start (or restart) Excel, open a workbook: Home › Loadwright › Rulesets opens the pane, and =LW.ENVELOPE(...) works in any cell.",
      `To remove it later: reg delete ${key} /v ${manifestId(manifest)} /f`,
    ];
  }
  if (process.platform === "darwin") {
    const wef = path.join(homedir(), "Library/Containers/com.microsoft.Excel/Data/Documents/wef");
    mkdirSync(wef, { recursive: true });
    copyFileSync(manifest, path.join(wef, "loadwright.manifest.xml"));
    return [
      `Copied the manifest to ${wef}.`,
      "Start (or restart) Excel, open a workbook: Home › Add-ins › Developer add-ins › Loadwright.",
      `To remove it later: delete ${path.join(wef, "loadwright.manifest.xml")}`,
    ];
  }
  return null;
}

function trustSteps(cert) {
  if (cert.trusted) return ["The development certificate is trusted on this computer."];
  const ca = path.join(CERT_DIR, CERT_FILES.ca);
  return [
    `The development certificate is NOT trusted yet (${cert.trustProblem}). Trust its authority once:`,
    `  system (Debian/Ubuntu): sudo cp ${ca} /usr/local/share/ca-certificates/office-addin-dev-ca.crt && sudo update-ca-certificates`,
    `  Chrome/Chromium/Edge on Linux (they keep their own list; needs libnss3-tools):`,
    `      certutil -d sql:$HOME/.pki/nssdb -A -t "C,," -n "Office Add-in Dev CA" -i ${ca}`,
    `  Firefox: Settings › Privacy & Security › Certificates › View Certificates › Authorities › Import › ${ca}`,
    `  Then restart the browser and check that the task pane page opens without a warning.`,
  ];
}

function webSteps(origin, manifest) {
  return [
    "Load it into Excel on the web:",
    `  1. In the browser you will use, open ${origin}/taskpane.html: it must open without a certificate warning (see above).`,
    "  2. Open a workbook in Excel on the web (excel.cloud.microsoft or office.com › Excel).",
    "  3. Home › Add-ins › More settings (or Advanced…) › Upload My Add-in › Browse…",
    `  4. Choose ${manifest} and Upload. The ribbon gets Home › Loadwright › Rulesets; type =LW.RULESET("…") or =LW.ENVELOPE(...) in a cell.`,
    "  The upload lives in that browser only; repeat it after clearing the browser's data.",
  ];
}

async function main() {
  const { port, sideload: wantSideload } = options(process.argv.slice(2));
  const origin = `https://localhost:${port}`;
  const cert = await certificates();
  const compiler = webpack(makeConfig({ origin }, { mode: "development" }));
  const server = new WebpackDevServer(
    {
      port,
      host: "localhost",
      server: { type: "https", options: cert.https },
      headers: { "Access-Control-Allow-Origin": "*" },
      hot: false,
      liveReload: false,
      client: false,
      webSocketServer: false,
      static: false,
      devMiddleware: { writeToDisk: false },
    },
    compiler,
  );
  const built = new Promise((resolve) => compiler.hooks.done.tap("loadwright-start", resolve));
  await server.start();
  await built;

  const manifest = manifestFor(origin);
  let desktop = null;
  try {
    desktop = wantSideload ? sideload(manifest) : null;
  } catch (e) {
    desktop = [`Could not load the add-in into Excel desktop (${e instanceof Error ? e.message.split("\n")[0] : String(e)}); load it by hand:`];
  }
  const lines = [
    "",
    `Loadwright is served at ${origin}/ (task pane ${origin}/taskpane.html, functions ${origin}/functions.json).`,
    "Results must be reviewed by a qualified, licensed engineer; the adopted code edition and local amendments govern;",
    "verify shipped rulesets against the standard before use (UNVERIFIED ones are from memory).",
    "",
    ...trustSteps(cert),
    "",
    ...(desktop ?? []),
    ...(desktop ? [""] : []),
    ...webSteps(origin, manifest),
    "",
    "Press Ctrl+C to stop the server.",
  ];
  console.log(lines.join("\n"));

  const stop = async () => {
    await server.stop();
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((e) => {
  const busy = e && e.code === "EADDRINUSE" ? " (another server uses the port: stop it, or choose one with --port N)" : "";
  console.error(`npm start: ${e instanceof Error ? e.message : String(e)}${busy}`);
  process.exit(1);
});
