// Package store keeps bench revisions: immutable snapshots of a design, each with a random id, its
// parent and its creation time. Bolt is the embedded file store used by the server; Mem keeps
// revisions in memory for tests.
package store
