package sway

import (
	"errors"
	"sync/atomic"

	"swaysheet/core/motion"
)

// A work budget bounds the time an evaluation (or a plan's many) may take,
// whatever the scenario: the step limit alone does not, because the cost
// of a step grows with the pieces of motion it looks at.
//
// Work is counted in units of about 13 ns of one core of the development
// machine (the cost of evaluating one moving piece of motion): every
// evaluation of the model (the integrator's and the scanner's) costs
// WorkPerEval units plus one per moving piece of every axis (motion.Work:
// a move, or a shaper's copy of it, that is moving at that time). The pieces are counted once per segment between restarts,
// where they do not change, and the budget is charged after every step.
const (
	// WorkPerEval is the cost of one evaluation of the model itself, in
	// work units (measured: 55 ns for one rope, 100 to 350 ns with a hook
	// block, against 13 ns for a piece).
	WorkPerEval = 16
	// WorkPerRigidEval is the cost of one evaluation of a rigid load
	// (pendulum.Rigid) with its share of the scan (measured 2026-12-04:
	// 0.9 to 1.3 us natively, figures only, on the three rigid examples:
	// 70 to 100 units). With WorkPerEval the budget let a rigid load run
	// about eight times longer than its stated time.
	WorkPerRigidEval = 100
	// DefaultWork is one evaluation's budget: about 2.6 s of one core. A
	// 0.3 m rope at rel_tol 1e-13 meets the step limit (500,000 steps)
	// first, at about 1e8.
	DefaultWork = 200_000_000
)

// ErrWorkLimit is matched (errors.Is) by the error of an evaluation that
// ran out of its work budget.
var ErrWorkLimit = errors.New("sway: work budget spent")

// runMessage is the message of an evaluation's own budget.
const runMessage = "This run needs more computing than allowed: shorten the moves or the run time, use fewer moves (or fewer shaped moves at the same time), or set a looser accuracy (settings.rel_tol)."

// Budget is an allowance of work, safe to share between evaluations that
// run at the same time (a plan's runs draw on one).
type Budget struct {
	left    atomic.Int64
	message string
}

// NewBudget is an allowance of work units; message (default: the run's
// own, naming what to shorten) is the error's text when it is spent.
func NewBudget(work int64, message string) *Budget {
	if message == "" {
		message = runMessage
	}
	b := &Budget{message: message}
	b.left.Store(work)
	return b
}

// take charges w units and reports whether the budget still holds.
func (b *Budget) take(w int64) bool { return b.left.Add(-w) >= 0 }

// WorkError is the error of a spent budget.
type WorkError struct{ Message string }

func (e *WorkError) Error() string { return e.Message }

// Is makes errors.Is(err, ErrWorkLimit) true.
func (e *WorkError) Is(target error) bool { return target == ErrWorkLimit }

// segmentWork is the cost of one evaluation between two restarts: the
// model's own (WorkPerEval, or WorkPerRigidEval for a rigid load) and one
// per moving piece.
func segmentWork(model int64, axes []motion.Profile, t float64) int64 {
	w := model
	for _, p := range axes {
		w += int64(motion.Work(p, t))
	}
	return w
}

// Spend charges w units of work done outside an evaluation (a planner's
// screening by the linear theory, for example) and reports whether the
// budget still holds; once it is spent the caller should stop and return
// a WorkError with the budget's message.
func (b *Budget) Spend(w int64) bool { return b.take(w) }

// Left is the work not yet spent (below zero once spent).
func (b *Budget) Left() int64 { return b.left.Load() }
