package editor

import (
	"sync"

	"propflight/app/project"
	"propflight/physics"
)

// Result is one recompute: the scene built from a document, its verdict
// and take, or the error that stopped it. Results are immutable once
// delivered.
type Result struct {
	Seq        uint64 // the request it answers; higher is newer
	Scene      *project.Scene
	Verdict    physics.Verdict
	Take       *physics.Take
	Thresholds physics.Thresholds
	Err        error
}

// Compute builds doc and flies its throw: the work one recompute does.
func Compute(doc *project.Document, thr physics.Thresholds) Result {
	sc, err := doc.Build()
	if err != nil {
		return Result{Err: err, Thresholds: thr}
	}
	v := physics.Judge(&sc.Mass, &sc.Throw, thr)
	take, err := physics.Simulate(&sc.Prop, &sc.Mass, &sc.Throw)
	if err != nil {
		return Result{Scene: sc, Verdict: v, Err: err, Thresholds: thr}
	}
	return Result{Scene: sc, Verdict: v, Take: take, Thresholds: thr}
}

// Worker recomputes on its own goroutine. Requests replace any request not
// yet started (latest wins), and a result is delivered only if no newer
// request has arrived by the time it is ready (stale results are dropped),
// so the deliver callback sees increasing Seq values and always, in the
// end, the latest request's result.
type Worker struct {
	deliver func(Result)

	mu      sync.Mutex
	cond    *sync.Cond
	pending *request
	latest  uint64
	closed  bool
	done    chan struct{}
}

type request struct {
	seq uint64
	doc *project.Document
	thr physics.Thresholds
}

// NewWorker starts a worker that calls deliver (from the worker goroutine)
// with each fresh result. A window wraps deliver's body in fyne.Do.
func NewWorker(deliver func(Result)) *Worker {
	w := &Worker{deliver: deliver, done: make(chan struct{})}
	w.cond = sync.NewCond(&w.mu)
	go w.loop()
	return w
}

// Request asks for doc (which the worker may keep: pass a copy such as
// Editor.Doc) to be computed with thr, and returns its sequence number.
func (w *Worker) Request(doc *project.Document, thr physics.Thresholds) uint64 {
	w.mu.Lock()
	defer w.mu.Unlock()
	w.latest++
	w.pending = &request{seq: w.latest, doc: doc, thr: thr}
	w.cond.Signal()
	return w.latest
}

// Close stops the worker after the computation in progress, if any.
func (w *Worker) Close() {
	w.mu.Lock()
	w.closed = true
	w.cond.Signal()
	w.mu.Unlock()
	<-w.done
}

func (w *Worker) loop() {
	defer close(w.done)
	for {
		w.mu.Lock()
		for w.pending == nil && !w.closed {
			w.cond.Wait()
		}
		if w.closed {
			w.mu.Unlock()
			return
		}
		req := w.pending
		w.pending = nil
		w.mu.Unlock()

		res := Compute(req.doc, req.thr)
		res.Seq = req.seq

		w.mu.Lock()
		stale := req.seq != w.latest
		w.mu.Unlock()
		if !stale {
			w.deliver(res)
		}
	}
}
