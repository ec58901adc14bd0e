package dev.annotator.cli;

import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintWriter;

/** The process's standard streams, passed down so commands can be run in-process by tests and embedders. */
record Streams(InputStream in, OutputStream out, PrintWriter err) {
}
