// Package cputime reads the process' CPU time for the benchmarks of core/
// (make bench): a ratio of CPU time is steadier than wall time on a shared
// machine. It is test support: nothing in the product imports it.
package cputime
