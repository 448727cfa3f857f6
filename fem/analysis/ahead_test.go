package analysis

import (
	"context"
	"reflect"
	"testing"
	"time"

	"stave/fem"
	"stave/fem/check"
)

// startHeld starts work ahead once the token is free: an analysis of
// another test may still be running its exact solution ahead.
func startHeld(t *testing.T, work func()) *ahead {
	t.Helper()
	for range 10_000 {
		if w := startAhead(work); w != nil {
			return w
		}
		time.Sleep(time.Millisecond)
	}
	t.Fatal("no work could start ahead in 10 s: the token was never freed")
	return nil
}

// One piece of work runs ahead at a time: while it runs a second start is
// refused (its caller then does the work itself), and once it has ended the
// next start runs.
func TestStartAheadOneAtATime(t *testing.T) {
	release := make(chan struct{})
	first := startHeld(t, func() { <-release })
	if second := startAhead(func() {}); second != nil {
		second.wait()
		t.Error("a second piece of work started ahead while the first ran")
	}
	close(release)
	first.wait()
	ran := false
	startHeld(t, func() { ran = true }).wait()
	if !ran {
		t.Error("work started after the first had ended did not run")
	}
}

// A panic of the work ahead ends that work alone (the work keeps it for
// whoever needs its result: fem.Member raises it again in Exact): it does
// not take the program down, the waiter is woken and the token is free
// again after it.
func TestAheadPanicEndsTheWorkAlone(t *testing.T) {
	w := startHeld(t, func() { panic("the exact solution failed") })
	w.wait()
	startHeld(t, func() {}).wait()
}

// Finish gives the exact solution fem.SolveExact gives, to the bit, whether
// Solve started it ahead or the token was held and Finish worked it out
// itself; Finish leaves the first stage's analysis as it was. Without
// Request.ExactAhead Solve starts none (a window's drag may drop it).
func TestFinishExactAheadOrNot(t *testing.T) {
	m := load(t, "demo.json")
	want, err := fem.SolveExact(&m)
	if err != nil {
		t.Fatal(err)
	}
	ctx := context.Background()
	for _, started := range []bool{true, false} {
		release := make(chan struct{})
		held := startHeld(t, func() { <-release }) // taken now, so free below only when released
		if started {
			close(release)
			held.wait()
		}
		r := Request{Model: m.Clone(), Checks: check.DefaultOptions(), ExactAhead: true}
		first, err := Solve(ctx, r)
		if !started {
			close(release)
			held.wait()
		}
		if err != nil || first.Err != nil || first.prepared == nil {
			t.Fatalf("started ahead %v: Solve: %v, %v, prepared %v", started, err, first.Err, first.prepared != nil)
		}
		if got := first.prepared.ahead != nil; got != started {
			t.Errorf("Solve started the exact solution ahead: %v, want %v", got, started)
		}
		a, err := Finish(ctx, r, first)
		if err != nil || a.Exact == nil || a.prepared != nil || first.prepared == nil {
			t.Fatalf("started ahead %v: Finish: %v, exact %v (%v), prepared kept %v, first stage's kept %v",
				started, err, a.Exact != nil, a.ExactErr, a.prepared != nil, first.prepared != nil)
		}
		L := m.Length()
		for i := range 41 {
			x := L * float64(i) / 40
			for _, side := range []fem.Side{fem.Left, fem.Right} {
				if got, want := a.Exact.At(x, side), want.At(x, side); !reflect.DeepEqual(got, want) {
					t.Errorf("started ahead %v: exact fields at x = %g m differ from fem.SolveExact's:\n%+v\n%+v", started, x, got, want)
				}
			}
		}
	}
}

// Solve starts no exact solution ahead unless asked: a window that drops
// first stages unfinished during a drag would throw the work away.
func TestSolveStartsNoExactUnasked(t *testing.T) {
	for aheadToken.Load() { // an earlier test's work may still be running
		time.Sleep(time.Millisecond)
	}
	r := Request{Model: load(t, "demo.json"), Checks: check.DefaultOptions()}
	first, err := Solve(context.Background(), r)
	if err != nil || first.Err != nil || first.prepared == nil {
		t.Fatalf("Solve: %v, %v", err, first.Err)
	}
	if first.prepared.ahead != nil {
		t.Error("Solve started the exact solution ahead unasked")
	}
}
