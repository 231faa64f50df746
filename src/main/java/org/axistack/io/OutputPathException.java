package org.axistack.io;

import java.io.IOException;

/**
 * An output path the tool will not write: a folder, a block device or a socket where a file was asked for, a file
 * where a folder was asked for, a dangling link, a folder that cannot be made or written. The command line shows
 * the message and exits 2 (bad input); the message names the path, what it is, and the fix.
 */
public final class OutputPathException extends IOException {
    private static final long serialVersionUID = 1L;

    public OutputPathException(String message) {
        super(message);
    }
}
