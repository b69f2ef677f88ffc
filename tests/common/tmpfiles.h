/* Test helpers for temporary input files. */
#ifndef SY_TEST_TMPFILES_H
#define SY_TEST_TMPFILES_H

#include <stddef.h>

/* A fresh private directory under $TMPDIR (or /tmp); returns its path (static buffer). */
const char *sy_test_tmpdir(void);
/* Write text to dir/name; returns the full path (static ring of buffers). Aborts the test
 * program (exit 1) if the file cannot be written: a broken harness must not pass. */
const char *sy_test_write(const char *dir, const char *name, const char *text);
const char *sy_test_write_bytes(const char *dir, const char *name, const void *data, size_t n);
/* Remove dir and everything below it (test clean-up). */
void sy_test_rmtree(const char *dir);

#endif
