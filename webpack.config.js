// Builds the add-in into dist/: one bundle (formulas and task pane share the
// runtime), taskpane.html and its stylesheet, functions.json generated from the JSDoc of
// src/functions/functions.ts, the icons, and manifest.xml with the URLs it is
// served from. `--env origin=https://host` builds for another origin than the
// development server's.
import path from "node:path";
import { fileURLToPath } from "node:url";
import CopyWebpackPlugin from "copy-webpack-plugin";
import CustomFunctionsMetadataPlugin from "custom-functions-metadata-plugin";
import HtmlWebpackPlugin from "html-webpack-plugin";

const here = path.dirname(fileURLToPath(import.meta.url));

/** The origin manifest.xml is written for; the development server serves here. */
export const DEV_ORIGIN = "https://localhost:3000";

export const FUNCTIONS_SOURCE = path.resolve(here, "src/functions/functions.ts");

export default (env = {}, argv = {}) => {
  const production = argv.mode !== "development";
  const origin = String(env.origin ?? DEV_ORIGIN).replace(/\/+$/, "");
  return {
    mode: production ? "production" : "development",
    context: here,
    // No eval-based source maps: the pane's Content-Security-Policy forbids eval in development too.
    devtool: production ? "source-map" : "cheap-module-source-map",
    entry: { taskpane: "./src/addin/main.ts" },
    output: {
      path: env.outputPath ? path.resolve(env.outputPath) : path.resolve(here, "dist"),
      filename: "[name].js",
      publicPath: "auto",
      clean: true,
    },
    resolve: {
      extensions: [".ts", ".js"],
      // Sources import "./x.js" as NodeNext requires; the file on disk is x.ts.
      extensionAlias: { ".js": [".ts", ".js"] },
    },
    module: {
      rules: [
        {
          test: /\.ts$/,
          exclude: /node_modules/,
          loader: "ts-loader",
          options: { onlyCompileBundledFiles: true, compilerOptions: { noEmit: false, sourceMap: true } },
        },
      ],
    },
    plugins: [
      new CustomFunctionsMetadataPlugin({ input: FUNCTIONS_SOURCE, output: "functions.json" }),
      new HtmlWebpackPlugin({ filename: "taskpane.html", template: "./src/taskpane/taskpane.html", chunks: ["taskpane"] }),
      new CopyWebpackPlugin({
        patterns: [
          { from: "assets/*.png", to: "assets/[name][ext]" },
          { from: "src/taskpane/taskpane.css", to: "taskpane.css" },
          {
            from: "manifest.xml",
            to: "manifest.xml",
            transform: (content) => content.toString().replaceAll(DEV_ORIGIN, origin),
          },
        ],
      }),
    ],
    performance: { maxEntrypointSize: 1_500_000, maxAssetSize: 1_500_000 },
    stats: "errors-warnings",
  };
};
