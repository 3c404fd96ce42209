"""One drawer per stage kind: each knows which stages it handles and draws them with schemdraw."""
