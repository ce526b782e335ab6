/**
 * The pane's Content-Security-Policy allows no eval (taskpane.html). zod
 * compiles object parsers with `new Function` where it may, and finds out by
 * trying, which a policy without eval reports as a violation; told it runs
 * without compiling, it never tries. Imported first by the add-in's entry, so
 * it is set before any schema is made.
 */
import { config } from "zod";

config({ jitless: true });
