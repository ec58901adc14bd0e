package dev.annotator.cli;

import dev.annotator.error.AnnotatorException;
import dev.annotator.error.ExitCodes;
import picocli.CommandLine;

import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/** Process entry point: runs the command line and exits with its status. */
public final class Main {
    private Main() {
    }

    public static void main(String[] args) {
        // System.out is a PrintStream, which swallows write errors; the descriptor itself reports them, so a full
        // disk or a closed pipe on standard output ends the run with exit 74 instead of a silent 0
        System.exit(run(args, System.in, new FileOutputStream(FileDescriptor.out), System.err));
    }

    /** Runs one command line on the given streams and returns the exit status (for tests and for embedding). */
    public static int run(String[] args, InputStream stdin, OutputStream stdout, PrintStream stderr) {
        boolean debug = Arrays.asList(args).contains("--debug");
        PrintWriter out = new PrintWriter(new OutputStreamWriter(stdout, StandardCharsets.UTF_8), true);
        PrintWriter err = new PrintWriter(new OutputStreamWriter(stderr, StandardCharsets.UTF_8), true);
        CommandLine cl = AnnotatorCommand.commandLine(new Streams(stdin, stdout, err), args);
        cl.setOut(out);
        cl.setErr(err);
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        cl.setUsageHelpWidth(100);
        cl.setParameterExceptionHandler((ex, a) -> {
            CommandLine cmd = ex.getCommandLine();
            err.println("annotator: error: " + oneLine(ex.getMessage()) + " (see '" + cmd.getCommandSpec().qualifiedName()
                    + " --help')");
            return ExitCodes.USAGE;
        });
        cl.setExecutionExceptionHandler((ex, cmd, parsed) -> {
            if (ex instanceof AnnotatorException ae) {
                err.println("annotator: error: " + oneLine(ae.getMessage()));
                if (debug) {
                    ex.printStackTrace(err);
                }
                return ae.exitCode();
            }
            err.println("annotator: error: internal error: " + oneLine(String.valueOf(ex))
                    + (debug ? "" : " (run again with --debug for details)"));
            if (debug) {
                ex.printStackTrace(err);
            }
            return ExitCodes.SOFTWARE;
        });
        int code;
        try {
            code = cl.execute(args);
        } catch (OutOfMemoryError e) {
            // inputs are sized to the heap before they are read (MemoryBudget), so this is a gap in that sizing;
            // the stack is unwound by now and its memory free, so one line can still be printed
            err.println("annotator: error: out of memory (Java heap limit " + (Runtime.getRuntime().maxMemory() >> 20)
                    + " MiB): give java more with -Xmx, or use fewer --threads; please report it, with --debug output");
            if (debug) {
                e.printStackTrace(err);
            }
            code = ExitCodes.SOFTWARE;
        }
        out.flush();
        // help, version and the listing commands print through this PrintWriter, which also swallows errors
        if (code == ExitCodes.OK && out.checkError()) {
            err.println("annotator: error: <stdout>: write failed");
            code = ExitCodes.IO;
        }
        err.flush();
        return code;
    }

    private static String oneLine(String message) {
        return message == null ? "" : message.replace('\n', ' ').replace('\r', ' ').strip();
    }
}
